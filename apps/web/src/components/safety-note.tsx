/** The standing safety reminder, shown wherever Varden gives guidance about work on a bank. */
export function SafetyNote() {
  return (
    <p className="flex max-w-measure gap-2 text-base text-ink-muted desk:text-sm">
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0 fill-none stroke-ink-muted stroke-[1.5]">
        {/* Two plates of a capacitor between their leads. */}
        <path d="M1 8h5M10 8h5M6 3v10M10 3v10" strokeLinecap="round" />
      </svg>
      <span>
        <strong className="font-semibold text-ink">Safety. </strong>
        Capacitors hold charge after isolation: isolate, lock out, wait the discharge time, verify absence of voltage,
        short and earth before touching. Follow your site's safety rules, local codes and licensed practice.
      </span>
    </p>
  );
}
