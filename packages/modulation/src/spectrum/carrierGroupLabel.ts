/**
 * The chart label of an order already split as order = carrierGroup·mf + sideband: `7`
 * (baseband), `mf`, `mf−2`, `2mf+1`, … (sidebands of a non-integer mf to two decimals).
 */
export function carrierGroupLabel(order: number, carrierGroup: number, sideband: number): string {
  if (carrierGroup === 0) return String(order);
  const multiple = carrierGroup === 1 ? 'mf' : `${carrierGroup}mf`;
  if (sideband === 0) return multiple;
  const magnitude = Number.isInteger(sideband) ? Math.abs(sideband) : Math.abs(sideband).toFixed(2);
  return `${multiple}${sideband > 0 ? '+' : '−'}${magnitude}`;
}
