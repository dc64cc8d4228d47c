import type { SiteHealth } from '@varden/schemas';
import { and, eq, isNull, like } from 'drizzle-orm';
import { appOrigin } from '../../config';
import type { AppContext } from '../../context';
import { outbox, sites, userRoles, users, viewerSiteGrants } from '../../db/schema/index';
import { enqueueMail } from '../../mail/outbox';
import { siteHealth } from './service';

const glyphWord = { healthy: '● healthy', watch: '▲ watch', replace: '■ replace', remeasure: '◆ remeasure' } as const;
const fixed = (n: number | null, digits = 1) => (n === null ? '—' : n.toFixed(digits));

/** The plain-text summary of one site's health, as the monthly mail carries it. */
export function summaryText(health: SiteHealth, link: string, month: string): string {
  const lines = [
    `${health.siteName}: correction health for ${month}`,
    '',
    `Installed ${fixed(health.installedKvar)} kvar, effective ${fixed(health.effectiveKvar)} kvar, lost ${fixed(health.lostKvar)} kvar (${fixed(health.lostPct)} %).`,
    health.reachedPf === null
      ? 'No load is recorded for this site, so the power factor it reaches is not known.'
      : `At the site's load the power factor reached is ${fixed(health.reachedPf, 3)}${health.leading ? ' (leading: over-corrected)' : ''} against a target of ${fixed(health.targetPf, 2)}; ${fixed(health.missingKvar)} kvar are missing.`,
    `Units: ${(Object.keys(glyphWord) as Array<keyof typeof glyphWord>).map((b) => `${health.bands[b]} ${glyphWord[b]}`).join(', ')}, ${health.bands.noReading} without a reading.`,
  ];
  if (health.cost) {
    lines.push(
      `Estimated cost of the lost correction: ${health.cost.currency} ${health.cost.lostMonthlyCost.toFixed(2)} a month (an estimate: ${health.cost.assumptions.join(' ')})`,
    );
  }
  const nearHarmonic = health.banks.flatMap((b) => b.steps.filter((s) => s.tuning?.nearHarmonic).map((s) => `${b.name} step ${s.number}`));
  if (nearHarmonic.length) lines.push(`Detuned steps tuned near a harmonic: ${nearHarmonic.join(', ')}.`);
  lines.push('', `Open the site's health page: ${link}`);
  return lines.join('\n');
}

/**
 * Queues this month's summary mail of each site's health for its supervisors and the viewers
 * granted the site, once per person, site and month: the outbox kind carries all three, so a
 * second run (another instance, a restart) finds the mail already queued and adds nothing.
 */
export async function queueMonthlySummaries(ctx: AppContext, today = new Date()): Promise<number> {
  const month = today.toISOString().slice(0, 7);
  const siteRows = await ctx.db.select({ id: sites.id }).from(sites).where(isNull(sites.retiredAt));
  const supervisors = await ctx.db
    .select({ id: users.id, email: users.email })
    .from(users)
    .innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(and(eq(userRoles.role, 'supervisor'), eq(users.active, true)));
  const already = new Set(
    (await ctx.db.select({ kind: outbox.kind }).from(outbox).where(like(outbox.kind, `site-summary:${month}:%`))).map((r) => r.kind),
  );
  let queued = 0;
  for (const { id: siteId } of siteRows) {
    const viewers = await ctx.db
      .select({ id: users.id, email: users.email })
      .from(users)
      .innerJoin(viewerSiteGrants, eq(viewerSiteGrants.userId, users.id))
      .where(and(eq(viewerSiteGrants.siteId, siteId), eq(users.active, true)));
    const recipients = [...supervisors, ...viewers].filter((r, i, all) => all.findIndex((o) => o.id === r.id) === i);
    const pending = recipients.filter((r) => !already.has(`site-summary:${month}:${siteId}:${r.id}`));
    if (pending.length === 0) continue;
    const health = await siteHealth(ctx.db, 'all', siteId, 500);
    const link = `${appOrigin(ctx.config)}/sites/${siteId}/health`;
    for (const r of pending) {
      await enqueueMail(ctx.db, `site-summary:${month}:${siteId}:${r.id}`, {
        to: r.email,
        subject: `${health.siteName}: correction health, ${month}`,
        text: summaryText(health, link, month),
      });
      queued++;
    }
  }
  return queued;
}
