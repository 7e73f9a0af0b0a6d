import { fieldsOf, searchOf } from './form-sync';

const blank = { q: '', analyteId: '', from: '' };

describe('fieldsOf', () => {
  it('shows the search in force as text, and nothing for what is not searched', () => {
    expect(fieldsOf(blank, { q: 'glucose', analyteId: 3, page: 2 })).toEqual({ q: 'glucose', analyteId: '3', from: '' });
  });
});

describe('searchOf', () => {
  it('leaves out blank fields, trims text and turns the named fields into numbers', () => {
    expect(searchOf({ q: '  lot 7 ', analyteId: '12', from: '' }, ['analyteId'])).toEqual({ q: 'lot 7', analyteId: 12 });
  });

  it('keeps ids as text unless named numeric', () => {
    expect(searchOf({ analyteId: '12' })).toEqual({ analyteId: '12' });
  });
});
