import type { SubscriptedSymbol } from '@shared/format';

/** A symbol with its subscript lowered, as people write it: ΔG<sub>ET</sub> (shared/format/quantity-symbols.ts). */
export function Subscripted({ symbol }: { symbol: SubscriptedSymbol }) {
  return (
    <>
      {symbol.base}
      <sub>{symbol.subscript}</sub>
    </>
  );
}
