import { outsideStated, sideOfStated } from './stated-limits';
import { verifyInterval } from './verify-interval';

describe('the "outside the stated interval" rule', () => {
  const closed = { lower: 3.5, upper: 5.1 };

  it('keeps a value equal to either limit inside: outside means strictly beyond', () => {
    expect(sideOfStated(3.5, closed)).toBeNull();
    expect(sideOfStated(5.1, closed)).toBeNull();
    expect(outsideStated(3.5, closed)).toBe(false);
    expect(outsideStated(5.1, closed)).toBe(false);
  });

  it('puts a value just beyond a limit outside, on its side', () => {
    expect(sideOfStated(3.49, closed)).toBe('below');
    expect(sideOfStated(5.11, closed)).toBe('above');
    expect(outsideStated(3.49, closed)).toBe(true);
    expect(outsideStated(5.11, closed)).toBe(true);
    expect(sideOfStated(4.2, closed)).toBeNull();
  });

  it('lets a missing lower limit bound nothing below (an interval "up to 5.1")', () => {
    const upperOnly = { lower: null, upper: 5.1 };
    expect(sideOfStated(-1000, upperOnly)).toBeNull();
    expect(sideOfStated(5.1, upperOnly)).toBeNull();
    expect(sideOfStated(5.2, upperOnly)).toBe('above');
  });

  it('lets a missing upper limit bound nothing above (an interval "from 3.5")', () => {
    const lowerOnly = { lower: 3.5, upper: null };
    expect(sideOfStated(1e6, lowerOnly)).toBeNull();
    expect(sideOfStated(3.5, lowerOnly)).toBeNull();
    expect(sideOfStated(3.4, lowerOnly)).toBe('below');
  });

  it('puts nothing outside when neither limit is given', () => {
    expect(outsideStated(-5, { lower: null, upper: null })).toBe(false);
    expect(outsideStated(5, { lower: null, upper: null })).toBe(false);
  });

  it("is the rule the engine's count uses: values on the limits are not counted, those beyond are, by side", () => {
    const values = [3.5, 5.1, 3.4, 5.2, 5.3, ...Array.from({ length: 15 }, () => 4.2)];
    const r = verifyInterval(values, closed, 1);
    expect(r).toMatchObject({ n: 20, below: 1, above: 2, outside: 3, allowedOutside: 2, accepted: false });
    expect(values.filter((v) => outsideStated(v, closed))).toEqual([3.4, 5.2, 5.3]);
  });
});
