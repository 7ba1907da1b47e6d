import { afterAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import bcrypt from 'bcryptjs';
import { guardTestDatabase, closeDb, request, params, makeUser } from '../support/db';
import { POST as signUp } from '@/app/api/account/route';
import { initModels, User, SignInAttempt } from '@/db/models';
import { verifyCredentials, SIGN_IN_LIMITS, setSiteRole } from '@/lib/server/users';

guardTestDatabase();
initModels();
const email = `signup-${Date.now()}@example.test`;

afterAll(async () => {
  await User.destroy({ where: { email: { [Op.like]: 'signup-%@example.test' } } });
  await SignInAttempt.destroy({ where: { subject: { [Op.in]: [email, '203.0.113.7', '203.0.113.8'] } } });
  await closeDb();
});

describe('sign-up', () => {
  test('bad input → 400 naming each field', async () => {
    const res = await signUp(request('/api/account', { method: 'POST', body: { name: 'A', email: 'not-an-email', password: 'short' } }), params({}));
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).fieldErrors).sort()).toEqual(['email', 'name', 'password']);
  });

  test('creates a member with a bcrypt hash, never the password', async () => {
    const res = await signUp(request('/api/account', { method: 'POST', body: { name: 'Wren Calloway', email: email.toUpperCase(), password: 'a long enough password' } }), params({}));
    expect(res.status).toBe(202);
    const user = (await User.findOne({ where: { email } }))!;
    expect(user.siteRole).toBe('member');
    expect(user.passwordHash).not.toContain('a long enough password');
    expect(await bcrypt.compare('a long enough password', user.passwordHash)).toBe(true);
  });

  test('the same e-mail again → the same 202 answer, and still one account (issue 11: no telling which addresses exist)', async () => {
    const res = await signUp(request('/api/account', { method: 'POST', body: { name: 'Wren Again', email, password: 'another long password' } }), params({}));
    expect(res.status).toBe(202);
    expect((await res.json()).fieldErrors).toBeUndefined();
    expect(await User.count({ where: { email } })).toBe(1);
  });
});

describe('sign-in rate limit', () => {
  test(`after ${SIGN_IN_LIMITS.perAccount} failures the account is refused even with the right password`, async () => {
    await expect(verifyCredentials(email, 'a long enough password', '203.0.113.7')).resolves.toMatchObject({ email });
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount; i++) {
      await expect(verifyCredentials(email, 'wrong password', `203.0.113.${i % 2 ? 7 : 8}`)).rejects.toThrow(/do not match/);
    }
    await expect(verifyCredentials(email, 'a long enough password', '203.0.113.9')).rejects.toThrow(/Too many failed sign-in attempts/);
  });

  test(`one address is refused after ${SIGN_IN_LIMITS.perAddress} failures across accounts`, async () => {
    const address = `198.51.100.${Math.floor(Math.random() * 200) + 1}`;
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) {
      await expect(verifyCredentials(`signup-nobody-${i}@example.test`, 'x', address)).rejects.toThrow(/do not match/);
    }
    await expect(verifyCredentials(`signup-someone-else@example.test`, 'x', address)).rejects.toThrow(/Too many/);
    await SignInAttempt.destroy({ where: { subject: address } });
  });
});

describe('site roles', () => {
  test('the last admin cannot be demoted', async () => {
    const others = await User.findAll({ where: { siteRole: 'admin' } });
    const [a, b] = await Promise.all([makeUser('admin'), makeUser('admin')]);
    // Leave a and b as the only admins for the length of the test.
    await User.update({ siteRole: 'member' }, { where: { id: { [Op.in]: others.map((o) => o.id) } } });
    try {
      await expect(setSiteRole(a.id, 'member')).resolves.toMatchObject({ siteRole: 'member' });
      await expect(setSiteRole(b.id, 'member')).rejects.toThrow(/last admin/);
      expect((await User.findByPk(b.id))!.siteRole).toBe('admin');
    } finally {
      await User.update({ siteRole: 'admin' }, { where: { id: { [Op.in]: others.map((o) => o.id) } } });
      await User.destroy({ where: { id: { [Op.in]: [a.id, b.id] } } });
    }
  });
});
