import type { NextFunction, Request, Response } from 'express';
import { inspectionPlanCreate, unitCreate, userIdParams } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { errorMiddleware } from './error-middleware';
import { validate } from './validate';

/** A response that records what the handler set, answered and put in locals. */
function fakeResponse() {
  const res = { locals: {} as Record<string, unknown>, statusCode: 200, body: undefined as unknown, setHeader() {} };
  const reply = res as unknown as Response;
  Object.assign(reply, {
    status: (code: number) => ((res.statusCode = code), reply),
    json: (body: unknown) => ((res.body = body), reply),
  });
  return { res, reply };
}

const toErrorMiddleware = (error: unknown, reply: Response) => errorMiddleware(error, { id: 'test' } as unknown as Request, reply, (() => {}) as NextFunction);

/** Runs validate() on a request and, when it throws, the error middleware: the API's answer to bad input. */
function answer(schemas: Parameters<typeof validate>[0], req: Partial<Request>) {
  const { res, reply } = fakeResponse();
  let passed = false;
  try {
    validate(schemas)({ params: {}, query: {}, body: {}, ...req } as Request, reply, (() => (passed = true)) as NextFunction);
  } catch (error) {
    toErrorMiddleware(error, reply);
  }
  return { passed, status: res.statusCode, body: res.body, locals: res.locals };
}

const plan = { bankId: 3, name: 'Annual inspection', intervalMonths: 12, checklist: ['capacitance'], nextDueOn: '2027-01-15' };

describe('validate with the shared zod/mini schemas', () => {
  it('puts the parsed input, defaults filled in, in res.locals', () => {
    const { passed, locals } = answer({ body: inspectionPlanCreate, params: userIdParams }, { body: plan, params: { id: '7' } });
    expect(passed).toBe(true);
    expect(locals.body).toEqual({ ...plan, leadDays: 14, active: true });
    expect(locals.params).toEqual({ id: 7 });
  });

  it("answers 400 with each field's message: the schema's own, or zod's English one, never a bare 'Invalid input'", () => {
    const { status, body } = answer({ body: inspectionPlanCreate }, { body: { ...plan, bankId: undefined, intervalMonths: 200, leadDays: 500, checklist: [], colour: 'red' } });
    expect(status).toBe(400);
    expect(body).toEqual({
      error: {
        code: 'invalid',
        message: 'Some fields are not valid.',
        fields: {
          bankId: 'Invalid input: expected number, received undefined',
          intervalMonths: 'At most 120 months',
          leadDays: 'Too big: expected number to be <=120',
          checklist: 'Choose at least one reading',
          _: 'Unrecognized key: "colour"',
        },
      },
    });
  });

  it("answers 400 for a ZodError thrown by a shared schema's own parse (zod/mini's error class)", () => {
    let thrown: unknown;
    try {
      unitCreate.parse({ stepId: 1, position: 0 });
    } catch (error) {
      thrown = error;
    }
    const { res, reply } = fakeResponse();
    toErrorMiddleware(thrown, reply);
    expect(res.statusCode).toBe(400);
    expect((res.body as { error: { fields: Record<string, string> } }).error.fields).toMatchObject({ position: 'Positions are numbered from 1' });
  });
});
