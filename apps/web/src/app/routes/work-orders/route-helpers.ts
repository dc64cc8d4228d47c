import { data, type Params } from 'react-router-dom';
import { isApiError } from '../../../lib/api-client';

/** A record id from the URL; anything else is a page that does not exist. */
export function idParam(params: Params, name: string): number {
  const id = Number(params[name]);
  if (!Number.isInteger(id) || id < 1) throw data({ message: 'This address does not lead to a record.' }, { status: 404 });
  return id;
}

/** Awaits a record for a loader; the API's 404 (missing, or outside the person's sites) becomes "Nothing here". */
export async function orNotFound<T>(load: Promise<T>): Promise<T> {
  try {
    return await load;
  } catch (error) {
    if (isApiError(error) && error.status === 404) throw data({ message: error.message }, { status: 404 });
    throw error;
  }
}
