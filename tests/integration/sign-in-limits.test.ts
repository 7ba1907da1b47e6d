// Sign-in limits against the real MariaDB: counted atomically, per account and per address, slowing
// rather than locking out; the address comes from the socket, not from what a client claims.
import { afterAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser } from '../support/db';
import { initModels, User, SignInAttempt } from '@/db/models';
import { verifyCredentials } from '@/lib/server/users';
import { SIGN_IN_LIMITS, delayAfter } from '@/lib/server/sign-in-limits';
import { clientAddress } from '@/lib/auth/options';

guardTestDatabase();
initModels();

const users: number[] = [];
const subjects: string[] = [];
async function account() {
  const u = await makeUser(); // password 'integration-pass'
  users.push(u.id);
  subjects.push(u.email);
  return u;
}
const address = () => {
  const a = `198.18.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250) + 1}`;
  subjects.push(a);
  return a;
};
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

afterAll(async () => {
  await SignInAttempt.destroy({ where: { subject: { [Op.in]: subjects } } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

describe('counting is atomic', () => {
  test(`25 parallel wrong guesses: at most ${SIGN_IN_LIMITS.perAccount} are checked, the rest refused unchecked`, async () => {
    const u = await account();
    const from = address();
    const results = await Promise.allSettled(Array.from({ length: 25 }, () => verifyCredentials(u.email, 'wrong guess', from)));
    const reasons = results.map((r) => (r.status === 'rejected' ? String((r.reason as Error).message) : 'signed in'));
    const checked = reasons.filter((m) => /do not match/.test(m)).length;
    const refused = reasons.filter((m) => /Too many failed sign-in attempts/.test(m)).length;
    expect(checked).toBe(SIGN_IN_LIMITS.perAccount);
    expect(refused).toBe(25 - SIGN_IN_LIMITS.perAccount);
    const row = await SignInAttempt.findOne({ where: { scope: 'account', subject: u.email } });
    expect(row?.failures).toBe(SIGN_IN_LIMITS.perAccount);
  });
});

describe('slowing, not locking out', () => {
  test('after the limit the real owner waits a short, growing delay, then gets in with the right password', async () => {
    const u = await account();
    const attacker = address();
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount; i++) {
      await expect(verifyCredentials(u.email, `guess ${i}`, attacker)).rejects.toThrow(/do not match/);
    }
    // Right away: refused, and told how long to wait.
    await expect(verifyCredentials(u.email, 'integration-pass', address())).rejects.toThrow(/Wait \d+ seconds?/);
    await sleep(delayAfter(SIGN_IN_LIMITS.perAccount, SIGN_IN_LIMITS.perAccount) + 100);
    await expect(verifyCredentials(u.email, 'integration-pass', address())).resolves.toMatchObject({ email: u.email });
    // The run is over: the next mistake is not delayed.
    await expect(verifyCredentials(u.email, 'typo', address())).rejects.toThrow(/do not match/);
  });

  test('the delay doubles per attempt past the limit, up to a cap (our policy)', () => {
    const L = SIGN_IN_LIMITS.perAccount;
    expect(delayAfter(L - 1, L)).toBe(0);
    expect(delayAfter(L, L)).toBe(SIGN_IN_LIMITS.firstDelayMs);
    expect(delayAfter(L + 1, L)).toBe(2 * SIGN_IN_LIMITS.firstDelayMs);
    expect(delayAfter(L + 3, L)).toBe(8 * SIGN_IN_LIMITS.firstDelayMs);
    expect(delayAfter(L + 1000, L)).toBe(SIGN_IN_LIMITS.maxDelayMs);
  });
});

describe('the client address', () => {
  test('a forged X-Forwarded-For does not reset the count', async () => {
    // As the server sees it: the socket's peer is stamped on every request; the client adds its own header.
    const peer = address();
    const asSeen = (forged: string) => clientAddress(new Headers({ 'x-scribeline-peer': peer, 'x-forwarded-for': forged }));
    expect(asSeen('203.0.113.1')).toBe(peer);
    expect(asSeen('203.0.113.2, 10.0.0.1')).toBe(peer);
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) {
      const from = asSeen(`203.0.113.${i + 1}`);
      await expect(verifyCredentials(`walls-nobody-${i}-${Date.now()}@example.test`, 'x', from)).rejects.toThrow(/do not match/);
    }
    subjects.push(...Array.from({ length: SIGN_IN_LIMITS.perAddress + 1 }, (_, i) => `walls-nobody-${i}`));
    await expect(verifyCredentials(`walls-someone-${Date.now()}@example.test`, 'x', asSeen('203.0.113.250'))).rejects.toThrow(/Too many/);
    const row = await SignInAttempt.findOne({ where: { scope: 'address', subject: peer } });
    expect(row?.failures).toBe(SIGN_IN_LIMITS.perAddress);
  });

  test('forwarded hops are believed only through TRUSTED_PROXIES, from the right', () => {
    const saved = process.env.TRUSTED_PROXIES;
    try {
      delete process.env.TRUSTED_PROXIES;
      expect(clientAddress(new Headers({ 'x-scribeline-peer': '127.0.0.1', 'x-forwarded-for': '203.0.113.9' }))).toBe('127.0.0.1');
      process.env.TRUSTED_PROXIES = '127.0.0.1, 10.0.0.0/8';
      // The proxy appended the address it saw; the client's own claim on the left is ignored.
      expect(clientAddress(new Headers({ 'x-scribeline-peer': '::ffff:127.0.0.1', 'x-forwarded-for': '1.2.3.4, 203.0.113.9' }))).toBe('203.0.113.9');
      expect(clientAddress(new Headers({ 'x-scribeline-peer': '127.0.0.1', 'x-forwarded-for': '1.2.3.4, 203.0.113.9, 10.1.2.3' }))).toBe('203.0.113.9');
      // Not from the proxy: the peer itself, whatever it claims.
      expect(clientAddress(new Headers({ 'x-scribeline-peer': '198.51.100.4', 'x-forwarded-for': '1.2.3.4' }))).toBe('198.51.100.4');
      expect(clientAddress(new Headers({ 'x-scribeline-peer': '127.0.0.1', 'x-forwarded-for': 'not-an-address' }))).toBe('unknown');
    } finally {
      if (saved === undefined) delete process.env.TRUSTED_PROXIES;
      else process.env.TRUSTED_PROXIES = saved;
    }
  });
});
