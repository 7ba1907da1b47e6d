import { describe, expect, it } from 'vitest';

import { AppError } from '@/lib/errors';
import { toErrorResponse } from '@/lib/http/errors';
import { authorizeDevTool, canUseDevTool, type Actor } from '@/lib/auth/policy';

// Issue 11: the dev mailbox shows every caught message (invitation and verification links included),
// so it is off unless switched on, and then only for signed-in admins; anyone else gets a 404.
const signedOut: Actor = null;
const member: Actor = { id: 7, siteRole: 'member', emailVerified: true };
const admin: Actor = { id: 1, siteRole: 'admin', emailVerified: true };

function statusOf(actor: Actor, devToolsEnabled: boolean): number {
  try {
    authorizeDevTool(actor, 'readDevMailbox', { devToolsEnabled });
    return 200;
  } catch (e) {
    expect(e).toBeInstanceOf(AppError);
    return toErrorResponse(e).status;
  }
}

describe('the dev mailbox in the policy', () => {
  it('is open to a signed-in admin where dev tools are on', () => {
    expect(canUseDevTool(admin, 'readDevMailbox', { devToolsEnabled: true })).toBe(true);
    expect(statusOf(admin, true)).toBe(200);
  });

  it.each([
    ['signed out', signedOut],
    ['a member', member],
  ])('does not exist for %s even where dev tools are on (404)', (_name, actor) => {
    expect(canUseDevTool(actor, 'readDevMailbox', { devToolsEnabled: true })).toBe(false);
    expect(statusOf(actor, true)).toBe(404);
  });

  it.each([
    ['signed out', signedOut],
    ['a member', member],
    ['an admin', admin],
  ])('does not exist for %s where dev tools are off (404)', (_name, actor) => {
    expect(canUseDevTool(actor, 'readDevMailbox', { devToolsEnabled: false })).toBe(false);
    expect(statusOf(actor, false)).toBe(404);
  });
});
