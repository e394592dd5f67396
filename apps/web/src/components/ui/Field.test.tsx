import { fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { describe, expect, it, vi } from 'vitest';
import {
  NumberField,
  numberListText,
  ParsedField,
  parseNumberList,
  SelectField,
  type FieldOption,
} from './Field';

// What the fields promise (issue 10, "forms that never lie"): the box shows exactly the text
// typed, the caller hears what it parses to with the validator's message, and that message is
// on the field. The values are typed text, so the checks are exact.

const positive = (value: number) => (value > 0 ? undefined : 'DC bus must be above 0');

/** A number field whose caller keeps what it hears, as a form does. */
function KeptNumber({ onHeard }: { onHeard: (value: number, error: string | undefined) => void }) {
  const [value, setValue] = useState(400);
  return (
    <>
      <NumberField
        label="DC bus"
        unit="V"
        value={value}
        validate={positive}
        onChange={(next, error) => {
          setValue(next);
          onHeard(next, error);
        }}
      />
      <button type="button" onClick={() => setValue(250)}>
        set elsewhere
      </button>
    </>
  );
}

describe('NumberField', () => {
  it('shows exactly the text typed: an emptied box stays empty and a leading zero stays', () => {
    const heard = vi.fn();
    render(<KeptNumber onHeard={heard} />);
    const box = screen.getByLabelText(/DC bus/);
    fireEvent.change(box, { target: { value: '' } });
    expect(box).toHaveValue('');
    expect(heard).toHaveBeenLastCalledWith(Number.NaN, 'DC bus must be above 0');
    fireEvent.change(box, { target: { value: '01.5' } });
    expect(box).toHaveValue('01.5');
    expect(heard).toHaveBeenLastCalledWith(1.5, undefined);
  });

  it('marks the field with the validator message and reports it, for letters and for a bad value', () => {
    const heard = vi.fn();
    render(<KeptNumber onHeard={heard} />);
    const box = screen.getByLabelText(/DC bus/);
    fireEvent.change(box, { target: { value: '-5' } });
    expect(box).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent('DC bus must be above 0');
    expect(heard).toHaveBeenLastCalledWith(-5, 'DC bus must be above 0');
    fireEvent.change(box, { target: { value: '4x' } });
    expect(box).toHaveValue('4x');
    expect(heard).toHaveBeenLastCalledWith(Number.NaN, 'DC bus must be above 0');
    fireEvent.change(box, { target: { value: '12' } });
    expect(box).not.toHaveAttribute('aria-invalid');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('follows a value set from elsewhere, and keeps a text that already stands for it', () => {
    render(<KeptNumber onHeard={() => undefined} />);
    const box = screen.getByLabelText(/DC bus/);
    fireEvent.change(box, { target: { value: '400.0' } });
    expect(box).toHaveValue('400.0');
    fireEvent.click(screen.getByRole('button', { name: 'set elsewhere' }));
    expect(box).toHaveValue('250');
  });

  it('shows the value scaled and reports it unscaled (henries shown as mH)', () => {
    const onChange = vi.fn();
    render(<NumberField label="L" unit="mH" value={0.005} scale={1e3} onChange={onChange} />);
    const box = screen.getByLabelText(/L/);
    expect(box).toHaveValue('5');
    fireEvent.change(box, { target: { value: '2.5' } });
    expect(onChange).toHaveBeenLastCalledWith(0.0025, undefined);
  });

  it('shows an error from elsewhere (the service) when the validator has none', () => {
    render(
      <NumberField
        label="Points"
        value={500}
        validate={() => undefined}
        error="points must be ≤ 400"
        onChange={() => undefined}
      />,
    );
    expect(screen.getByRole('alert')).toHaveTextContent('points must be ≤ 400');
  });
});

describe('ParsedField', () => {
  it('parses a typed list and names a bad entry through its validator', () => {
    const onChange = vi.fn();
    const odd = (orders: number[]) =>
      orders.every((o) => Number.isInteger(o) && o % 2 === 1 && o >= 3)
        ? undefined
        : 'each order must be an odd whole number ≥ 3';
    render(
      <ParsedField
        label="Orders"
        value={[5, 7]}
        format={numberListText}
        parse={parseNumberList}
        validate={odd}
        onChange={onChange}
      />,
    );
    const box = screen.getByLabelText('Orders');
    expect(box).toHaveValue('5, 7');
    fireEvent.change(box, { target: { value: '5 7,11' } });
    expect(box).toHaveValue('5 7,11');
    expect(onChange).toHaveBeenLastCalledWith([5, 7, 11], undefined);
    fireEvent.change(box, { target: { value: '5, 8' } });
    expect(onChange).toHaveBeenLastCalledWith([5, 8], 'each order must be an odd whole number ≥ 3');
    expect(screen.getByRole('alert')).toHaveTextContent('odd whole number');
  });
});

describe('parseNumberList', () => {
  it('splits on commas and spaces and gives NaN for an entry that is not a number', () => {
    expect(parseNumberList(' 5, 7  11,')).toEqual([5, 7, 11]);
    expect(parseNumberList('5, x')).toEqual([5, Number.NaN]);
    expect(parseNumberList('')).toEqual([]);
  });
});

describe('SelectField', () => {
  it('reports the chosen option with its type, once per choice', () => {
    type Window = 'hann' | 'flat-top';
    const options: readonly FieldOption<Window>[] = [
      { value: 'hann', label: 'Hann' },
      { value: 'flat-top', label: 'Flat-top' },
    ];
    const onValueChange = vi.fn<(value: Window) => void>();
    render(
      <SelectField label="Window" value="hann" options={options} onValueChange={onValueChange} />,
    );
    fireEvent.change(screen.getByLabelText('Window'), { target: { value: 'flat-top' } });
    expect(onValueChange).toHaveBeenLastCalledWith('flat-top');
    expect(onValueChange).toHaveBeenCalledTimes(1);
  });
});
