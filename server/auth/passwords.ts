import bcrypt from 'bcryptjs';

const COST = 10;
export const hashPassword = (plain: string): Promise<string> => bcrypt.hash(plain, COST);
export const checkPassword = (plain: string, hash: string | null): Promise<boolean> =>
  hash ? bcrypt.compare(plain, hash) : bcrypt.compare(plain, DUMMY).then(() => false);
// Compared against when the e-mail is unknown, so the answer takes as long either way.
const DUMMY = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.mhvR8Nfr5aB6HhX8y0s4zYHoRlN6';
