import { QueryClient } from '@tanstack/react-query';
import type { SessionResponse } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { session } from '../api/session-queries';
import { destinationAfterSignIn, requirePermission, requireSession } from './route-guards';

const planner: SessionResponse = {
  user: {
    id: 3,
    email: 'teodor@example.test',
    name: 'Teodor Vasquell',
    active: true,
    status: 'active',
    roles: ['planner'],
    siteIds: [],
    createdAt: '2026-12-01T08:00:00.000Z',
    lastSignInAt: '2026-12-02T08:00:00.000Z',
  },
  permissions: ['public', 'signed-in', 'register:read', 'register:write', 'work-orders:schedule'],
};

function clientWith(me: SessionResponse | null): QueryClient {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
  queryClient.setQueryData(session.queryKey, me);
  return queryClient;
}

const request = (path: string) => new Request(`http://varden.test${path}`);

async function thrown(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (error) {
    return error;
  }
  throw new Error('expected the guard to throw');
}

describe('requireSession', () => {
  it('sends someone signed out to sign in, with the page they asked for as next', async () => {
    const response = await thrown(requireSession(clientWith(null), request('/people?page=2')));
    expect(response).toBeInstanceOf(Response);
    expect((response as Response).status).toBe(302);
    expect((response as Response).headers.get('Location')).toBe('/sign-in?next=%2Fpeople%3Fpage%3D2');
  });

  it('lets the signed-in person through', async () => {
    await expect(requireSession(clientWith(planner), request('/planning'))).resolves.toEqual(planner);
  });
});

describe('requirePermission', () => {
  it('answers 403 to a signed-in person without the permission', async () => {
    const error = await thrown(requirePermission(clientWith(planner), request('/people'), 'users:manage'));
    // data(…, { status }) as thrown; the router hands it to the section's boundary as a 403.
    expect(error).toMatchObject({ init: { status: 403 }, data: { message: expect.stringMatching(/administrator/) } });
  });

  it('still sends someone signed out to sign in rather than refusing them', async () => {
    const response = await thrown(requirePermission(clientWith(null), request('/people'), 'users:manage'));
    expect((response as Response).headers.get('Location')).toBe('/sign-in?next=%2Fpeople');
  });

  it('lets a holder of the permission through', async () => {
    await expect(requirePermission(clientWith(planner), request('/planning'), 'work-orders:schedule')).resolves.toEqual(planner);
  });
});

describe('destinationAfterSignIn', () => {
  it('goes to a safe next, else to the home of the role', () => {
    expect(destinationAfterSignIn(planner, '/sites/4')).toBe('/sites/4');
    expect(destinationAfterSignIn(planner, 'https://evil.example')).toBe('/planning');
    expect(destinationAfterSignIn(planner, null)).toBe('/planning');
  });
});
