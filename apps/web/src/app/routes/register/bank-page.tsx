import { useMutation, useQueryClient, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { Quantity } from '../../../components/quantity';
import { bankMutations, bankQueries } from '../../../features/register/api/bank-queries';
import { siteQueries } from '../../../features/register/api/site-queries';
import { stepQueries } from '../../../features/register/api/step-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { formatDate, formatDetuning, formatRatio } from '../../../features/register/components/formats';
import { LinkButton } from '../../../features/register/components/link-button';
import { PanelSection } from '../../../features/register/components/panel-section';
import { RecordFacts } from '../../../features/register/components/record-facts';
import { RetirePanel } from '../../../features/register/components/retire-panel';
import { useCanWriteRegister } from '../../../features/register/components/use-register-write';
import { RegisterWriteOnly } from '../../../features/register/components/write-gate';
import { BankBuildPanel, buildSearch } from '../../../features/register/panel/bank-build-panel';
import { prefetchBankComponents, useBankRegister } from '../../../features/register/panel/bank-register';
import { PanelDrawing } from '../../../features/register/panel/panel-drawing';
import { PanelTable } from '../../../features/register/panel/panel-table';
import { paths } from '../../../config/paths';
import { allowed, idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request);
    const bankId = idParam(params, 'bankId');
    const bank = await orNotFound(queryClient.ensureQueryData(bankQueries.detail(bankId)));
    // The steps and the site are awaited; the components stream in while the page shows.
    prefetchBankComponents(queryClient, bankId);
    await Promise.all([queryClient.ensureQueryData(stepQueries.ofBank(bankId)), queryClient.ensureQueryData(siteQueries.detail(bank.siteId))]);
    return null;
  };

/** Bank page: the panel drawing and its table, the bank's facts, and the build panel for writers. */
export default function BankPage() {
  const bankId = idParam(useParams(), 'bankId');
  const { data: bank } = useSuspenseQuery(bankQueries.detail(bankId));
  const { data: site } = useSuspenseQuery(siteQueries.detail(bank.siteId));
  const register = useBankRegister(bankId);
  const canWrite = useCanWriteRegister();
  const queryClient = useQueryClient();
  const update = useMutation(bankMutations.update(queryClient));
  const remove = useMutation(bankMutations.remove(queryClient));
  const navigate = useNavigate();
  const installedKvar = register.steps.reduce((sum, step) => sum + step.ratedKvar, 0);

  return (
    <>
      <Breadcrumbs
        trail={[
          { label: 'Sites', href: paths.register.sites.getHref() },
          { label: site.name, href: paths.register.site.getHref(site.id) },
          { label: bank.name },
        ]}
      />
      <PageHeader
        eyebrow={`Bank · ${site.name}`}
        title={bank.name}
        documentTitle={`${bank.name} · ${site.name}`}
        lead={bank.location || undefined}
        actions={
          <>
            <LinkButton to={paths.register.bankLabels.getHref(bank.id)}>Label sheet</LinkButton>
            <RegisterWriteOnly>
              <LinkButton to={paths.register.bankImport.getHref(bank.id)}>Import a register</LinkButton>
              <LinkButton to={paths.register.editBank.getHref(bank.id)}>Change the bank</LinkButton>
            </RegisterWriteOnly>
          </>
        }
      />
      {bank.retiredAt && (
        <p role="status" className="mb-6 rounded border border-line-strong bg-sunken p-3">
          Retired on {formatDate(bank.retiredAt)}: kept in the records, left out of the lists.
        </p>
      )}

      <div className="grid gap-6">
        <PanelSection title="Bank">
          <RecordFacts
            facts={[
              { label: 'Detuning', value: bank.detuned ? `Detuned, p ${formatDetuning(bank.detuningFactor)}` : 'Not detuned' },
              { label: 'Installed', value: <Quantity value={installedKvar} unit="kvar" />, testId: 'bank-installed-kvar' },
              { label: 'Steps', value: <span className="numeric">{register.steps.length}</span> },
              { label: 'Capacitor units', value: <span className="numeric">{register.loading ? '…' : register.units.length}</span> },
              { label: 'Controller target PF', value: <span className="numeric">{formatRatio(bank.controllerTargetPf)}</span> },
              { label: 'Commissioned on', value: formatDate(bank.commissionedOn) },
              { label: 'Network', value: <><Quantity value={site.voltageV} unit="V" />, <Quantity value={site.frequencyHz} unit="Hz" /></> },
            ]}
          />
        </PanelSection>

        <PanelSection title="Panel drawing">
          {register.failed ? (
            <p role="alert">Some of the bank's components did not load; reload the page to try again.</p>
          ) : (
            <div aria-busy={register.loading}>
              <PanelDrawing
                bank={bank}
                steps={register.steps}
                componentsOf={register.componentsOf}
                {...(canWrite ? { addHref: (kind, step) => buildSearch(kind, step) } : {})}
              />
            </div>
          )}
        </PanelSection>

        <PanelTable bank={bank} register={register} />

        <RegisterWriteOnly>
          <BankBuildPanel bank={bank} site={site} register={register} />
          <RetirePanel
            noun="bank"
            retired={bank.retiredAt !== null}
            onRetire={(retired) => update.mutateAsync({ id: bank.id, body: { version: bank.version, retired } })}
            onDelete={async () => {
              await remove.mutateAsync({ id: bank.id, siteId: bank.siteId });
              navigate(paths.register.site.getHref(bank.siteId));
            }}
          />
        </RegisterWriteOnly>
      </div>
    </>
  );
}
