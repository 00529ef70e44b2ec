import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from '../../../server/services/passwords';

describe('password hashing (scrypt)', () => {
  it('verifies the right password and refuses a wrong one', async () => {
    const hash = await hashPassword('correct horse battery');
    expect(hash).toMatch(/^scrypt\$32768\$8\$1\$[A-Za-z0-9_-]+\$[A-Za-z0-9_-]+$/);
    expect(await verifyPassword('correct horse battery', hash)).toBe(true);
    expect(await verifyPassword('correct horse batterY', hash)).toBe(false);
  });

  it('salts: the same password hashes differently each time', async () => {
    expect(await hashPassword('same password')).not.toBe(await hashPassword('same password'));
  });

  it('does not truncate: passwords differing only after 72 characters differ', async () => {
    const stem = 'x'.repeat(100);
    const hash = await hashPassword(stem + '1');
    expect(await verifyPassword(stem + '2', hash)).toBe(false);
  });

  it('treats composed and decomposed accents as the same password (NFKC)', async () => {
    const hash = await hashPassword('caf\u00e9-password');
    expect(await verifyPassword('cafe\u0301-password', hash)).toBe(true);
  });

  it('never matches a malformed stored value', async () => {
    for (const stored of ['', 'plain', 'scrypt$1$2$3', 'bcrypt$a$b$c$d$e', 'scrypt$0$8$1$AAAA$']) {
      expect(await verifyPassword('anything', stored)).toBe(false);
    }
  });
});
