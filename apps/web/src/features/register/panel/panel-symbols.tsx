import type { SymbolKind } from './panel-layout';

/**
 * Small line pictures of a step's components, in a 28-unit box, drawn in the ink colour: a
 * fuse (a cartridge with its element), a contactor (an open make contact), a detuning reactor
 * (a coil) and a capacitor (two plates).
 */
export function ComponentSymbol({ kind, x, y }: { kind: SymbolKind; x: number; y: number }) {
  return (
    <g transform={`translate(${x} ${y})`} className="fill-none stroke-ink" strokeWidth="1.75" strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
      {kind === 'fuse-set' && (
        <>
          <path d="M14 0v5M14 23v5" />
          <rect x="9.5" y="5" width="9" height="18" rx="1" />
          <path d="M14 5v18" />
        </>
      )}
      {kind === 'contactor' && (
        <>
          <path d="M14 0v8M14 20v8" />
          <path d="M14 20 7 9" />
          <path d="M11 8h6" />
        </>
      )}
      {kind === 'reactor' && (
        <>
          <path d="M14 0v4M14 24v4" />
          <path d="M14 4c5 0 5 5 0 5c5 0 5 5 0 5c5 0 5 5 0 5c5 0 5 5 0 5" />
        </>
      )}
      {kind === 'unit' && (
        <>
          <path d="M14 0v11M14 17v11" />
          <path d="M6 11h16M6 17h16" strokeWidth="2.25" />
        </>
      )}
    </g>
  );
}
