/** "step 2", "steps 1–4", "steps 1, 3 and 4": runs of consecutive numbers joined by an en dash. */
export function stepsText(numbers: readonly number[]): string {
  const sorted = [...new Set(numbers)].sort((a, b) => a - b);
  if (sorted.length === 0) return 'no steps';
  if (sorted.length === 1) return `step ${sorted[0]}`;
  const runs: string[] = [];
  let start = sorted[0]!;
  let previous = start;
  for (const n of [...sorted.slice(1), Number.NaN]) {
    if (n === previous + 1) {
      previous = n;
      continue;
    }
    runs.push(start === previous ? `${start}` : previous === start + 1 ? `${start}, ${previous}` : `${start}–${previous}`);
    start = n;
    previous = n;
  }
  const parts = runs.join(', ').split(', ');
  const last = parts.pop();
  return `steps ${parts.length > 0 ? `${parts.join(', ')} and ${last}` : last}`;
}

/** "Step 3 of Bank A". */
export function stepOfBank(stepNumber: number, bankName: string): string {
  return `Step ${stepNumber} of ${bankName}`;
}
