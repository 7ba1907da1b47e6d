import { describe, expect, it } from 'vitest';

import { AppError } from '@/lib/http/errors';
import { authorizeDevTool, canUseDevTool, type Actor } from '@/lib/auth/policy';

const actors: [string, Actor][] = [
  ['signed out', null],
  ['member', { id: 7, siteRole: 'member' }],
  ['admin', { id: 1, siteRole: 'admin' }],
];

describe('the dev mailbox in the policy', () => {
  it.each(actors)('is open to %s where dev tools are on', (_name, actor) => {
    expect(canUseDevTool(actor, 'readDevMailbox', { devToolsEnabled: true })).toBe(true);
    expect(() => authorizeDevTool(actor, 'readDevMailbox', { devToolsEnabled: true })).not.toThrow();
  });

  it.each(actors)('does not exist for %s where dev tools are off (404)', (_name, actor) => {
    expect(canUseDevTool(actor, 'readDevMailbox', { devToolsEnabled: false })).toBe(false);
    const err = (() => {
      try {
        authorizeDevTool(actor, 'readDevMailbox', { devToolsEnabled: false });
      } catch (e) {
        return e;
      }
    })();
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(404);
  });
});
