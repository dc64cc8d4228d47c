import { AppError } from '../../http/app-error';

/**
 * Runs a computation of packages/engineering on what a technician entered. Its RangeError says
 * which value cannot come from a real unit and why; it becomes a 400 on `field` with that
 * message (never a 500), and cannot be confirmed away.
 */
export function fromEngineering<T>(field: string, compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof RangeError) {
      const why = error.message.replace(/^\w+: /, '');
      throw new AppError('invalid', `These values cannot come from a real component: ${why}.`, { [field]: capitalise(why) });
    }
    throw error;
  }
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * Values that are possible but unlikely (a slip of the decimal point, the wrong meter range):
 * the technician is told why and may confirm them with `confirmImplausible: true`.
 */
export class ImplausibleValues {
  private readonly fields: Record<string, string> = {};

  add(field: string, why: string): void {
    this.fields[field] ??= why;
  }

  get reasons(): string[] {
    return Object.values(this.fields);
  }

  /** Throws the 400 unless the technician confirmed; returns what was confirmed, for the record. */
  settle(confirmed: boolean): string[] {
    const reasons = this.reasons;
    if (reasons.length === 0 || confirmed) return reasons;
    const fields: Record<string, string> = {};
    for (const [field, why] of Object.entries(this.fields)) {
      fields[field] = `${why} If this is what you measured, confirm it and send it again.`;
    }
    throw new AppError('invalid', 'Some values look implausible. Check them, or confirm them if they are what you measured.', fields, undefined, {
      confirmable: true,
    });
  }
}
