/**
 * A number as a technician types it on a phone: "248.7" or "248,7" (a decimal comma, as many
 * keyboards give with inputMode="decimal"), spaces ignored. Undefined when empty, NaN when it
 * is not a number.
 */
export function parseDecimal(text: string | undefined): number | undefined {
  const cleaned = (text ?? '').replace(/\s/g, '').replace(',', '.');
  if (cleaned === '') return undefined;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(cleaned)) return Number.NaN;
  return Number(cleaned);
}

/** "3 min", "1 min 30 s", "45 s": a wait as the safety card says it. */
export function formatWait(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  const minutes = Math.floor(s / 60);
  const rest = s % 60;
  return rest === 0 ? `${minutes} min` : `${minutes} min ${rest} s`;
}

/** The message of an engineering RangeError without its function name ("legsFromOpenPairs: …"). */
export function reasonOf(error: RangeError): string {
  const text = error.message.replace(/^\w+: /, '');
  return text.charAt(0).toUpperCase() + text.slice(1);
}
