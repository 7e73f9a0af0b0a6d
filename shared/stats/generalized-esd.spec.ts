import { defaultEsdMax, generalizedEsd } from './generalized-esd';

describe('generalizedEsd', () => {
  const clean = Array.from({ length: 40 }, (_, i) => Math.sin(i * 1.7) * 2);
  it('flags nothing in clean data', () => {
    expect(generalizedEsd(clean, 0.05, 3).outliers).toEqual([]);
  });
  it('flags two planted outliers, even side by side (no masking)', () => {
    const data = [...clean, 15, 15.5];
    expect(generalizedEsd(data, 0.05, 4).outliers.sort()).toEqual([40, 41]);
  });
  it('defaults the bound to 5% of n, at least 1', () => {
    expect(defaultEsdMax(10)).toBe(1);
    expect(defaultEsdMax(120)).toBe(6);
  });
});
