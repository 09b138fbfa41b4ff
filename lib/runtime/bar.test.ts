import { describe, expect, it } from 'vitest';
import { compareToTarget, layoutRuntimeBar } from './bar';

describe('layoutRuntimeBar', () => {
  const segs = [
    { id: 'a', totalSeconds: 60 },
    { id: 'b', totalSeconds: 0 },
    { id: 'c', totalSeconds: 180 },
  ];

  it('gives each segment its share of the forecast when there is no target', () => {
    const bar = layoutRuntimeBar(segs, null);
    expect(bar.totalSeconds).toBe(240);
    expect(bar.scaleSeconds).toBe(240);
    expect(bar.targetAt).toBeNull();
    expect(bar.slices).toEqual([
      { id: 'a', seconds: 60, offset: 0, width: 0.25 },
      { id: 'c', seconds: 180, offset: 0.25, width: 0.75 },
    ]);
  });

  it('scales to the target when the forecast is shorter, leaving the rest of the bar empty', () => {
    const bar = layoutRuntimeBar(segs, 480);
    expect(bar.scaleSeconds).toBe(480);
    expect(bar.targetAt).toBe(1);
    expect(bar.slices.reduce((sum, s) => sum + s.width, 0)).toBeCloseTo(0.5);
  });

  it('marks the target inside the bar when the forecast runs over', () => {
    const bar = layoutRuntimeBar(segs, 120);
    expect(bar.scaleSeconds).toBe(240);
    expect(bar.targetAt).toBe(0.5);
    expect(bar.slices.reduce((sum, s) => sum + s.width, 0)).toBeCloseTo(1);
  });

  it('has no slices and no division by zero when nothing is forecast', () => {
    const bar = layoutRuntimeBar([{ id: 'a', totalSeconds: 0 }], null);
    expect(bar).toEqual({ totalSeconds: 0, scaleSeconds: 0, slices: [], targetAt: null });
    expect(layoutRuntimeBar([], 900).targetAt).toBe(1);
  });
});

describe('compareToTarget', () => {
  it('reports over, under, on target and no target', () => {
    expect(compareToTarget(900, 860)).toEqual({ kind: 'over', bySeconds: 40 });
    expect(compareToTarget(860, 900)).toEqual({ kind: 'under', bySeconds: 40 });
    expect(compareToTarget(900, 900)).toEqual({ kind: 'on_target' });
    expect(compareToTarget(900, null)).toEqual({ kind: 'no_target' });
  });

  it('gives no verdict while nothing is forecast, so an empty episode is not "under target" (issue 15)', () => {
    expect(compareToTarget(0, 840)).toEqual({ kind: 'empty' });
    expect(compareToTarget(0.4, 840)).toEqual({ kind: 'empty' });
    expect(compareToTarget(1, 840)).toEqual({ kind: 'under', bySeconds: 839 });
  });

  it('treats a zero target as no target', () => {
    expect(compareToTarget(60, 0)).toEqual({ kind: 'no_target' });
  });
});
