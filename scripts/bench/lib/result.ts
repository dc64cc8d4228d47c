// One line of bench/results.json, and the file a part writes for the orchestrator.
import { writeFileSync } from 'node:fs';

export interface BenchResult {
  name: string;
  value: number;
  unit: string;
  /** The budget in words, e.g. "≤ 40 ms" or "≥ 50 % of baseline". */
  budget: string;
  pass: boolean;
}

/** Writes the part's results where the orchestrator asked (`--json FILE`) and prints them. */
export function writeResults(results: BenchResult[]): void {
  const at = process.argv.indexOf('--json');
  const file = at >= 0 ? process.argv[at + 1] : undefined;
  if (file) writeFileSync(file, JSON.stringify(results, null, 2));
  else console.table(results);
}

export const atMost = (name: string, value: number, unit: string, budget: number): BenchResult => ({
  name,
  value: Number(value.toFixed(value < 10 ? 3 : 1)),
  unit,
  budget: `≤ ${budget} ${unit}`,
  pass: value <= budget,
});

export const atLeast = (name: string, value: number, unit: string, budget: number): BenchResult => ({
  name,
  value: Number(value.toFixed(value < 10 ? 3 : 1)),
  unit,
  budget: `≥ ${budget} ${unit}`,
  pass: value >= budget,
});
