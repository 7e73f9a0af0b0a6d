import { NAVIGATION, NavItem, navigationFor, sectionsOf } from './navigation';

const ids = (items: NavItem[]) => items.map((item) => item.id);

const ADMIN_PAGES = ['users', 'analytes', 'instruments', 'release-templates', 'mailbox'];

describe('navigationFor', () => {
  it('gives every role the worklist and the profile', () => {
    for (const role of ['technologist', 'director', 'quality', 'admin'] as const) {
      expect(ids(navigationFor([role]))).toEqual(expect.arrayContaining(['worklist', 'profile']));
    }
  });

  it('gives the admin pages to administrators only', () => {
    expect(ids(navigationFor(['admin']))).toEqual(expect.arrayContaining(ADMIN_PAGES));
    for (const role of ['technologist', 'director', 'quality'] as const) {
      expect(ids(navigationFor([role])).filter((id) => ADMIN_PAGES.includes(id))).toEqual([]);
    }
  });

  it('gives Releases to technologists, directors and quality officers, not to administrators', () => {
    for (const role of ['technologist', 'director', 'quality'] as const) expect(ids(navigationFor([role]))).toContain('releases');
    expect(ids(navigationFor(['admin']))).not.toContain('releases');
    expect(NAVIGATION.find((item) => item.id === 'release-templates')?.path).toBe('/admin/release-templates');
  });

  it('keeps the defined order', () => {
    const items: NavItem[] = ['a', 'b', 'c'].map((id) => ({ id, label: id, icon: 'x', path: `/${id}`, roles: ['quality'], description: '' }));
    expect(ids(navigationFor(['quality'], items))).toEqual(['a', 'b', 'c']);
  });

  it('shows an entry once to a user who holds several of its roles', () => {
    const items: NavItem[] = [
      { id: 'studies', label: 'Studies', icon: 'x', path: '/studies', roles: ['technologist', 'director'], description: '' },
      { id: 'archive', label: 'Archive', icon: 'x', path: '/archive', roles: ['quality'], description: '' },
    ];
    expect(ids(navigationFor(['technologist', 'director'], items))).toEqual(['studies']);
  });

  it('gives no entries to a user without roles', () => {
    expect(navigationFor([])).toEqual([]);
  });

  it('gives every entry a unique id and a path starting with a slash', () => {
    expect(new Set(ids([...NAVIGATION])).size).toBe(NAVIGATION.length);
    expect(NAVIGATION.every((item) => item.path.startsWith('/'))).toBe(true);
  });
});

describe('sectionsOf', () => {
  it('groups consecutive entries under their heading and keeps ungrouped ones apart', () => {
    const item = (id: string, group?: string): NavItem => ({ id, label: id, icon: 'x', path: `/${id}`, roles: ['admin'], group, description: '' });
    const sections = sectionsOf([item('a'), item('b'), item('c', 'Admin'), item('d', 'Admin'), item('e')]);
    expect(sections.map((s) => [s.group, ids(s.items)])).toEqual([
      [null, ['a', 'b']],
      ['Admin', ['c', 'd']],
      [null, ['e']],
    ]);
  });

  it('puts the admin pages of the real navigation under one Admin heading', () => {
    const admin = sectionsOf(navigationFor(['admin'])).filter((s) => s.group === 'Admin');
    expect(admin).toHaveLength(1);
    expect(ids(admin[0].items)).toEqual(expect.arrayContaining(ADMIN_PAGES));
  });
});
