import { DESIGN_BOUNDS, type BridgeScheme, type ZeroSequence } from '@pulsewright/modulation';
import { useState, type FormEvent } from 'react';
import { rangeError } from '../../../lib/fieldRange';
import { fieldErrorOf, useCreateMaSweep } from '../../../lib/api';
import {
  MA_BOUNDS,
  MAX_ORDER_BOUNDS,
  MAX_TRACKED_ORDERS,
  POINTS_BOUNDS,
  RATIO_BOUNDS,
  type SweepMethod,
} from './sweepBounds';

/**
 * The sweep form's state: method, scheme or zero sequence, the numbers and the tracked orders,
 * each field's range check, and the submit that starts the sweep job on the service
 * (`onStarted` receives the new job's id).
 */
export function useSweepForm(onStarted: (jobId: string) => void) {
  const [method, setMethod] = useState<SweepMethod>('sine-triangle');
  const [scheme, setScheme] = useState<BridgeScheme>('bipolar');
  const [zeroSequence, setZeroSequence] = useState<ZeroSequence>('none');
  const [numbers, setNumbers] = useState({
    mf: 21,
    vdc: 400,
    from: 0.1,
    to: 1.2,
    points: 60,
    maxOrder: 120,
  });
  // Orders whose amplitude is recorded at every ma: the carrier group around the default mf 21.
  const [orders, setOrders] = useState<number[]>([3, 19, 21, 23, 41, 43]);
  const start = useCreateMaSweep();
  // The library's bounds where it owns them (ma, DC bus); the service names the others' ranges.
  const checks = {
    mf: rangeError('Frequency ratio mf', numbers.mf, RATIO_BOUNDS),
    vdc: rangeError('DC bus', numbers.vdc, DESIGN_BOUNDS.vdc, { unit: 'V' }),
    from: rangeError('ma from', numbers.from, MA_BOUNDS),
    to:
      rangeError('ma to', numbers.to, MA_BOUNDS) ??
      (numbers.to < numbers.from
        ? `ma to must be at least ma from, ${numbers.from} (entered ${numbers.to})`
        : undefined),
    points: rangeError('Points', numbers.points, POINTS_BOUNDS),
    maxOrder: rangeError('Highest order', numbers.maxOrder, MAX_ORDER_BOUNDS),
    orders: ordersError(orders, numbers.maxOrder),
  };
  const valid = Object.values(checks).every((message) => message === undefined);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!valid) return;
    const { mf, vdc, from, to, points, maxOrder } = numbers;
    start.mutate(
      {
        modulation:
          method === 'three-phase'
            ? { method, ma: from, mf, vdc, zeroSequence }
            : { method, scheme, ma: from, mf, vdc },
        ma: { from, to, points },
        maxOrder,
        orders,
      },
      { onSuccess: (created) => onStarted(created.id) },
    );
  };
  const set = (key: keyof typeof numbers) => (value: number) =>
    setNumbers((current) => ({ ...current, [key]: value }));
  const err = (path: string) => fieldErrorOf(start.error, path);
  return {
    method,
    setMethod,
    scheme,
    setScheme,
    zeroSequence,
    setZeroSequence,
    numbers,
    orders,
    setOrders,
    start,
    checks,
    valid,
    submit,
    set,
    err,
  };
}

/** The message for the tracked orders, or undefined: whole numbers 0 to the highest order, at most 20. */
function ordersError(orders: readonly number[], maxOrder: number): string | undefined {
  if (orders.length > MAX_TRACKED_ORDERS)
    return `Harmonic orders to track: at most ${MAX_TRACKED_ORDERS} (entered ${orders.length})`;
  const highest = Number.isInteger(maxOrder) ? maxOrder : MAX_ORDER_BOUNDS.max;
  for (const order of orders) {
    const message = rangeError('Each tracked order', order, {
      min: 0,
      max: highest,
      integer: true,
    });
    if (message) return message;
  }
  return undefined;
}
