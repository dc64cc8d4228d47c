import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, apiRequest, clientErrorCodes, parseApiError } from './api-client';

const json = (body: unknown, status: number) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

const asString = (value: unknown) => {
  if (typeof value !== 'string') throw new TypeError('expected a string');
  return value;
};

describe('parseApiError', () => {
  it("reads the server's error shape with its field messages", async () => {
    const response = json(
      { error: { code: 'invalid', message: 'Some fields are not valid.', fields: { 'unit.capacitanceUF': 'Too small' } } },
      400,
    );

    const error = await parseApiError(response);

    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      name: 'ApiError',
      status: 400,
      code: 'invalid',
      message: 'Some fields are not valid.',
      fields: { 'unit.capacitanceUF': 'Too small' },
      isUnreachable: false,
    });
  });

  it('gives empty fields when the server sends none, and drops fields that are not messages', async () => {
    const error = await parseApiError(
      json({ error: { code: 'conflict', message: 'Locked.', fields: { a: 3, b: 'kept' } } }, 409),
    );
    expect(error.fields).toEqual({ b: 'kept' });

    const withoutFields = await parseApiError(json({ error: { code: 'not_found', message: 'No such bank.' } }, 404));
    expect(withoutFields).toMatchObject({ status: 404, code: 'not_found', fields: {} });
  });

  it('calls a 5xx without the error shape unreachable: a proxy answered, not Varden', async () => {
    const error = await parseApiError(new Response('', { status: 502 }));
    expect(error).toMatchObject({ status: 502, code: clientErrorCodes.unreachable, isUnreachable: true });
  });

  it('calls a 4xx that is not JSON an unexpected response', async () => {
    const error = await parseApiError(new Response('<!doctype html>', { status: 404 }));
    expect(error).toMatchObject({ status: 404, code: clientErrorCodes.unexpectedResponse, isUnreachable: true });
  });
});

describe('apiRequest', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('returns parsed data, and treats accepted statuses as data', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => json('degraded', 503)));
    await expect(apiRequest('/api/health', { parse: asString, acceptStatuses: [503] })).resolves.toBe('degraded');
  });

  it('throws the ApiError of a refused request', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => json({ error: { code: 'forbidden', message: 'Supervisors only.' } }, 403)));
    await expect(apiRequest('/api/work-orders/1', { parse: asString })).rejects.toMatchObject({
      status: 403,
      code: 'forbidden',
      message: 'Supervisors only.',
    });
  });

  it('throws unreachable when no answer arrives', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('fetch failed'))));
    await expect(apiRequest('/api/health', { parse: asString })).rejects.toMatchObject({
      status: 0,
      code: clientErrorCodes.unreachable,
    });
  });

  it('throws an unexpected response when a 200 is not JSON or not the expected shape', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response('<!doctype html>', { status: 200 })));
    await expect(apiRequest('/api/health', { parse: asString })).rejects.toMatchObject({
      code: clientErrorCodes.unexpectedResponse,
    });

    vi.stubGlobal('fetch', vi.fn(async () => json({ status: 'up' }, 200)));
    await expect(apiRequest('/api/health', { parse: asString })).rejects.toMatchObject({
      code: clientErrorCodes.unexpectedResponse,
    });
  });

  it('sends JSON bodies with their content type', async () => {
    const fetchMock = vi.fn(async (_input: RequestInfo | URL, _init?: RequestInit) => new Response(null, { status: 204 }));
    vi.stubGlobal('fetch', fetchMock);

    await apiRequest('/api/sites', { method: 'POST', body: { name: 'Alder Quay' }, parse: () => undefined });

    const init = fetchMock.mock.calls[0]?.[1];
    expect(init).toMatchObject({
      method: 'POST',
      body: '{"name":"Alder Quay"}',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    });
  });
});
