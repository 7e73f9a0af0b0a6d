import { usesDemingRatio } from './study-text';

describe('study text', () => {
  it('asks for the error ratio only for the Deming methods', () => {
    expect(usesDemingRatio('deming')).toBe(true);
    expect(usesDemingRatio('weighted-deming')).toBe(true);
    expect(usesDemingRatio('passing-bablok')).toBe(false);
    expect(usesDemingRatio('ols')).toBe(false);
  });
});
