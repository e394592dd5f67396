import { Button } from '../ui/Button';

/**
 * The zoom and pan buttons of an angle-axis chart: zoom by 2 and by ½, pan a quarter of the
 * window left and right, and back to the whole period.
 */
export function ZoomButtons({
  onZoom,
  onPan,
  onReset,
}: {
  /** Called with 2 (in) or 0.5 (out). */
  onZoom: (factor: number) => void;
  /** Called with −0.25 (left) or 0.25 (right), fractions of the window shown. */
  onPan: (fraction: number) => void;
  onReset: () => void;
}) {
  return (
    <>
      <Button variant="ghost" onClick={() => onZoom(2)} aria-label="Zoom in">
        +
      </Button>
      <Button variant="ghost" onClick={() => onZoom(0.5)} aria-label="Zoom out">
        −
      </Button>
      <Button variant="ghost" onClick={() => onPan(-0.25)} aria-label="Pan left">
        ←
      </Button>
      <Button variant="ghost" onClick={() => onPan(0.25)} aria-label="Pan right">
        →
      </Button>
      <Button variant="ghost" onClick={onReset}>
        Reset
      </Button>
    </>
  );
}
