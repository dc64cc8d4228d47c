import { describe, expect, it } from 'vitest';
import { checkRegisterCsv, registerCsvTemplate, type RegisterCsvContext } from './register-csv';

const header = 'step,step_kvar,position,kvar,voltage_v,frequency_hz,connection,capacitance_uf,serial,maker,model,installed_on';
const file = (...rows: string[]) => [header, ...rows].join('\n');
const emptyBank: RegisterCsvContext = { bankId: 7, steps: [], occupied: [] };

describe('checkRegisterCsv', () => {
  it('accepts a valid file and counts the steps and units it adds', () => {
    const check = checkRegisterCsv(
      file('1,50,1,25,400,50,delta,,A-1,,,2024-03-01', '1,50,2,25,400,50,delta,,A-2,,,', '2,50,1,50,400,50,Delta,,B-1,,,'),
      emptyBank,
    );
    expect(check.ok).toBe(true);
    expect(check.rows.map((row) => row.errors)).toEqual([[], [], []]);
    expect(check.rows.map((row) => row.line)).toEqual([2, 3, 4]);
    expect(check.plan).toEqual({ newSteps: [1, 2], units: 3 });
  });

  it('names a missing column and checks no row', () => {
    const check = checkRegisterCsv('step,step_kvar,position,kvar,voltage_v,frequency_hz\n1,50,1,25,400,50', emptyBank);
    expect(check.ok).toBe(false);
    expect(check.missingColumns).toEqual(['connection']);
    expect(check.fileErrors.join(' ')).toMatch(/lacks the column connection/);
    expect(check.rows).toEqual([]);
  });

  it('takes the optional columns as optional, and lists unknown ones as ignored', () => {
    const check = checkRegisterCsv('Step, step_kvar ,position,kvar,voltage_v,frequency_hz,connection,colour\n1,50,1,25,400,50,star,red', emptyBank);
    expect(check.ok).toBe(true);
    expect(check.ignoredColumns).toEqual(['colour']);
  });

  it('lists a bad number, an unknown connection and a bad date on their rows', () => {
    const check = checkRegisterCsv(
      file('1,50,1,25,400,50,delta,,,,,', '1,50,2,twenty,400,50,delta,,,,,', '1,50,3,25,400,50,zigzag,,,,,', '1,50,4,25,400,55,delta,,,,,1 March'),
      emptyBank,
    );
    expect(check.ok).toBe(false);
    expect(check.rows[0]?.errors).toEqual([]);
    expect(check.rows[1]?.errors).toEqual(['kvar “twenty” is not a number']);
    expect(check.rows[2]?.errors.join(' ')).toMatch(/^connection: Connection is delta, star or single-phase/);
    expect(check.rows[3]?.errors.join(' ')).toMatch(/frequency_hz: Network frequency is 50 or 60 Hz/);
    expect(check.rows[3]?.errors.join(' ')).toMatch(/installed_on: A date as YYYY-MM-DD/);
    expect(check.plan.units).toBe(1);
  });

  it('lists an empty required cell and an out-of-range value with the schema’s words', () => {
    const check = checkRegisterCsv(file('1,50,,25,400,50,delta,,,,,', '1,50,40,25,400,50,delta,,,,,', '0,50,1,25,400,50,delta,,,,,'), emptyBank);
    expect(check.rows[0]?.errors).toEqual(['position is empty']);
    expect(check.rows[1]?.errors).toEqual(['position: At most 32 units in a step']);
    expect(check.rows[2]?.errors).toEqual(['step: Steps are numbered from 1']);
  });

  it('finds a position used twice in the file', () => {
    const check = checkRegisterCsv(file('1,50,1,25,400,50,delta,,,,,', '1,50,2,25,400,50,delta,,,,,', '1,50,1,25,400,50,delta,,,,,'), emptyBank);
    expect(check.rows[2]?.errors).toEqual(['step 1 position 1 is also on line 2']);
    expect(check.ok).toBe(false);
  });

  it('finds a position that already holds a unit in service, and a step whose kvar disagrees', () => {
    const bank: RegisterCsvContext = { bankId: 7, steps: [{ number: 1, ratedKvar: 50 }], occupied: [{ stepNumber: 1, position: 1 }] };
    const check = checkRegisterCsv(file('1,50,1,25,400,50,delta,,,,,', '1,50,2,25,400,50,delta,,,,,', '1,25,3,25,400,50,delta,,,,,'), bank);
    expect(check.rows[0]?.errors).toEqual(['step 1 position 1 already holds a unit in service']);
    expect(check.rows[1]?.errors).toEqual([]);
    expect(check.rows[2]?.errors).toEqual(['step_kvar 25 differs from step 1’s 50 kvar']);
    expect(check.plan).toEqual({ newSteps: [], units: 1 });
  });

  it('refuses an empty file and a file with a header only', () => {
    expect(checkRegisterCsv('', emptyBank).fileErrors).toEqual(['The file is empty.']);
    expect(checkRegisterCsv(`${header}\n`, emptyBank).fileErrors).toEqual(['The file has a header but no rows.']);
  });

  it('accepts its own template', () => {
    const check = checkRegisterCsv(registerCsvTemplate(), emptyBank);
    expect(check.ok).toBe(true);
    expect(check.plan).toEqual({ newSteps: [1], units: 2 });
  });

  it('accepts a decimal comma in a quoted cell and a byte-order mark', () => {
    const check = checkRegisterCsv(`\uFEFF${file('1,50,1,"12,5",400,50,delta,,,,,')}`, emptyBank);
    expect(check.ok).toBe(true);
  });
});
