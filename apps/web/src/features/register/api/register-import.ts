import { mutationOptions, type QueryClient } from '@tanstack/react-query';
import { registerImportResponse, registerImportRow, type RegisterImportResponse } from '@varden/schemas';
import * as z from 'zod/mini';
import { apiRequest } from '../../../lib/api-client';
import { bankQueries } from './bank-queries';
import { stepQueries } from './step-queries';
import { unitQueries } from './unit-queries';

/**
 * A refused import (400): the error shape with each row's errors beside it. The shared
 * schemas do not describe this body yet (reported to the lead), so it is read here.
 */
const importRefusal = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.optional(z.record(z.string(), z.string())),
    rows: z.optional(z.array(registerImportRow)),
    missingColumns: z.optional(z.array(z.string())),
    ignoredColumns: z.optional(z.array(z.string())),
  }),
});

export type RegisterImportAnswer =
  | { accepted: true; result: RegisterImportResponse }
  | {
      accepted: false;
      message: string;
      rows: RegisterImportResponse['rows'];
      missingColumns: string[];
      fieldMessages: string[];
    };

export function parseRegisterImportAnswer(json: unknown): RegisterImportAnswer {
  const refusal = importRefusal.safeParse(json);
  if (refusal.success) {
    const { message, rows = [], missingColumns = [], fields = {} } = refusal.data.error;
    return { accepted: false, message, rows, missingColumns, fieldMessages: Object.values(fields) };
  }
  return { accepted: true, result: registerImportResponse.parse(json) };
}

/** POST /api/banks/:id/register-import: a preview when dryRun, else the import itself, all or nothing. */
export function postRegisterImport({ bankId, csv, dryRun }: { bankId: number; csv: string; dryRun: boolean }) {
  return apiRequest(`/api/banks/${bankId}/register-import`, {
    method: 'POST',
    body: { csv, dryRun },
    // A refusal lists every row's errors: data for the preview, not a failure of the request.
    acceptStatuses: [400],
    parse: parseRegisterImportAnswer,
  });
}

export const registerImportMutations = {
  send: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: postRegisterImport,
      onSuccess: (answer, { bankId, dryRun }) => {
        if (dryRun || !answer.accepted) return;
        return Promise.all([
          queryClient.invalidateQueries({ queryKey: stepQueries.lists() }),
          queryClient.invalidateQueries({ queryKey: unitQueries.lists() }),
          queryClient.invalidateQueries({ queryKey: bankQueries.detail(bankId).queryKey }),
          queryClient.invalidateQueries({ queryKey: bankQueries.lists() }),
        ]);
      },
      meta: { handlesErrors: true },
    }),
};
