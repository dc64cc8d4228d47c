import { inspectionPlanCreate, signInRequest, stepCreate } from '@varden/schemas';
import type { FieldErrors, FieldValues, ResolverOptions } from 'react-hook-form';
import { describe, expect, it } from 'vitest';
import { zodResolver } from './schema-messages';

// What react-hook-form passes a resolver, for a form without native validation.
const options = <T extends FieldValues>() => ({ fields: {}, shouldUseNativeValidation: false }) as ResolverOptions<T>;
const messages = (errors: FieldErrors) => Object.fromEntries(Object.entries(errors).map(([field, error]) => [field, error?.message]));

describe('form resolvers on the shared zod/mini schemas', () => {
  it("show the schema's own messages", async () => {
    const { errors } = await zodResolver(signInRequest)({ email: 'not an address', password: '' }, undefined, options());
    expect(messages(errors)).toEqual({ email: 'Enter an e-mail address such as name@example.com', password: 'Enter your password' });
  });

  it("show zod's English message for a check without one of its own, never a bare 'Invalid input'", async () => {
    const plan = { bankId: 3, name: 'Annual', intervalMonths: 12, leadDays: 500, checklist: ['capacitance' as const], nextDueOn: '2027-01-15' };
    const { errors } = await zodResolver(inspectionPlanCreate)(plan, undefined, options());
    expect(messages(errors)).toEqual({ leadDays: 'Too big: expected number to be <=120' });
    const step = await zodResolver(stepCreate)({ bankId: 1, number: 1.5, ratedKvar: 50 }, undefined, options());
    expect(messages(step.errors)).toEqual({ number: 'Invalid input: expected int, received number' });
  });

  it('give the parsed values, defaults filled in, when the input passes', async () => {
    const { values } = await zodResolver(inspectionPlanCreate)({ bankId: 3, name: ' Annual ', intervalMonths: 12, checklist: ['capacitance'], nextDueOn: '2027-01-15' }, undefined, options());
    expect(values).toEqual({ bankId: 3, name: 'Annual', intervalMonths: 12, leadDays: 14, checklist: ['capacitance'], nextDueOn: '2027-01-15', active: true });
  });
});
