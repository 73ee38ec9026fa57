import { describe, expect, it } from 'vitest';
import { nextUMove, type UReading } from '../../src/features/editor/u-move';

const reading = (U: number, unit = 'mm', symbol = 'L'): UReading => ({ U, unit, symbol });

describe('nextUMove: how the last edit moved U, like with like', () => {
  it('reports a move between two results of the same measurand in the same unit', () => {
    expect(nextUMove(reading(0.002), reading(0.0025), null)).toEqual({ from: 0.002, to: 0.0025 });
  });

  it('says nothing after a change of the measurand unit: 0.002 mm and 2 µm are the same U, not +99 900 %', () => {
    expect(nextUMove(reading(0.002, 'mm'), reading(2, 'um'), { from: 0.001, to: 0.002 })).toBeNull();
  });

  it('says nothing after a change of the measurand', () => {
    expect(nextUMove(reading(0.002, 'mm', 'L'), reading(0.003, 'mm', 'D'), null)).toBeNull();
  });

  it('keeps the last move on screen when an edit leaves U as it was', () => {
    const shown = { from: 0.002, to: 0.0025 };
    expect(nextUMove(reading(0.0025), reading(0.0025), shown)).toBe(shown);
  });

  it('has nothing to compare with before the first result', () => {
    expect(nextUMove(null, reading(0.002), null)).toBeNull();
  });
});
