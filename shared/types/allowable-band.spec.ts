import { allowableAt, allowableBand, bandReach } from './allowable-band';

const fmt = (v: number): string => v.toFixed(2);

describe('allowable-bias band of the difference plot', () => {
  it('is flat at ±A for an absolute goal on absolute differences', () => {
    const band = allowableBand(2, 20, { absolute: 0.5, percent: null }, 'absolute', fmt)!;
    expect(band).toEqual({ flat: true, points: [{ x: 2, half: 0.5 }, { x: 20, half: 0.5 }], words: '±0.50' });
  });

  it('is flat at ±P % for a percentage goal on percent differences', () => {
    const band = allowableBand(2, 20, { absolute: null, percent: 5 }, 'percent-mean', fmt)!;
    expect(band.flat).toBe(true);
    expect(band.points.map((p) => p.half)).toEqual([5, 5]);
    expect(band.words).toBe('±5 %');
  });

  it('widens with x for a percentage goal on absolute differences', () => {
    const band = allowableBand(0, 20, { absolute: null, percent: 5 }, 'absolute', fmt, 4)!;
    expect(band.flat).toBe(false);
    expect(band.points).toEqual([{ x: 0, half: 0 }, { x: 5, half: 0.25 }, { x: 10, half: 0.5 }, { x: 15, half: 0.75 }, { x: 20, half: 1 }]);
  });

  it('takes the greater of both goals and puts a point at the corner where they meet', () => {
    // 0.5 absolute or 5 %: equal at x = 10 (5 % of 10 = 0.5), the absolute limit below, the percentage above.
    const band = allowableBand(2, 20, { absolute: 0.5, percent: 5 }, 'absolute', fmt, 3)!;
    expect(band.points.map((p) => p.x)).toEqual([2, 8, 10, 14, 20]);
    expect(band.points.map((p) => p.half)).toEqual([0.5, 0.5, 0.5, expect.closeTo(0.7, 12), 1]);
    expect(band.words).toBe('±0.50 or ±5 %, whichever is greater');
  });

  it('turns an absolute goal into a percentage of x on percent differences', () => {
    expect(allowableAt(10, { absolute: 0.5, percent: null }, 'percent-x')).toBe(5);
    expect(allowableAt(0, { absolute: 0.5, percent: null }, 'percent-x')).toBe(Infinity);
    expect(allowableAt(4, { absolute: 0.5, percent: 5 }, 'percent-mean')).toBe(12.5);
  });

  it('is not drawn without a goal', () => {
    expect(allowableBand(0, 1, { absolute: null, percent: null }, 'absolute', fmt)).toBeNull();
    expect(allowableAt(3, { absolute: null, percent: null }, 'absolute')).toBeNull();
  });

  it('is reached by the axis unless it is far wider than the points and lines', () => {
    const band = allowableBand(2, 20, { absolute: 0.5, percent: null }, 'absolute', fmt);
    expect(bandReach(band, 0.8)).toBe(0.5);
    expect(bandReach(band, 0.1)).toBeNull();
    expect(bandReach(allowableBand(0, 20, { absolute: 0.5, percent: null }, 'percent-x', fmt), 10)).toBeNull();
    expect(bandReach(null, 1)).toBeNull();
  });
});
