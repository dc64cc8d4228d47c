import { createMemoryRouter, data } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { ApiError, clientErrorCodes } from '../../lib/api-client';
import { explainRouteError } from './route-error';

/** Runs one loader through a real data router and returns what its boundary would receive. */
async function errorFromLoader(loader: () => never): Promise<unknown> {
  const router = createMemoryRouter([{ id: 'page', path: '/', loader, Component: () => null }]);
  await new Promise<void>((resolve) => {
    if (router.state.initialized) resolve();
    else router.subscribe((state) => state.initialized && resolve());
  });
  const error = router.state.errors?.page;
  router.dispose();
  return error;
}

describe('explainRouteError', () => {
  it('explains `throw data(…, { status: 404 })` from a loader as a missing page', async () => {
    const error = await errorFromLoader(() => {
      throw data('No bank has this number.', { status: 404 });
    });
    expect(explainRouteError(error)).toEqual({ title: 'Nothing here', message: 'No bank has this number.' });
  });

  it('uses the message of an object thrown with data()', async () => {
    const error = await errorFromLoader(() => {
      throw data({ message: 'Only supervisors sign off.' }, { status: 403 });
    });
    expect(explainRouteError(error)).toEqual({ title: 'Not allowed', message: 'Only supervisors sign off.' });
  });

  it('explains an ApiError the server could not be reached for', () => {
    const error = new ApiError(0, clientErrorCodes.unreachable, 'Could not reach the server.');
    expect(explainRouteError(error).title).toBe('Could not reach the server');
  });

  it('keeps a fault in the code vague for the reader', () => {
    expect(explainRouteError(new TypeError('x is undefined')).title).toBe('Something went wrong');
  });
});
