import { describe, expect, it, vi } from 'vitest';
import type { ResolverOptions } from 'react-hook-form';
import { lazyZodResolver } from '@/components/forms/lazy-resolver';
import { signInSchema, type SignInInput } from '@/lib/validations/user';

// The account forms load their zod schema on first use (components/forms/lazy-resolver.ts). The resolver must
// answer exactly as the schema does once loaded, and must not strand the form when the code cannot be fetched.

const options = { shouldUseNativeValidation: false, fields: {} } as unknown as ResolverOptions<SignInInput>;

describe('lazyZodResolver', () => {
  it('answers with the schema’s own messages, field by field, once it has loaded', async () => {
    let loads = 0;
    const resolver = lazyZodResolver<SignInInput>(async () => {
      loads += 1;
      return signInSchema;
    });
    const bad = await resolver({ email: 'not an address', password: '' }, undefined, options);
    expect(Object.keys(bad.errors).sort()).toEqual(['email', 'password']);
    expect(bad.errors.email?.message).toBe(signInSchema.safeParse({ email: 'not an address', password: 'x' }).error?.issues[0]?.message);
    const good = await resolver({ email: '  Edda@Renwick-Shop.TEST ', password: 'shop-demo-2026' }, undefined, options);
    expect(good.errors).toEqual({});
    // The schema's output (trimmed, lower case), not what was typed.
    expect(good.values).toEqual({ email: 'edda@renwick-shop.test', password: 'shop-demo-2026' });
    resolver.preload();
    expect(loads).toBe(1); // loaded once, whatever asks for it
  });

  it('lets the form through unchecked when the code cannot be fetched, and tries again on the next submit', async () => {
    let attempt = 0;
    const resolver = lazyZodResolver<SignInInput>(async () => {
      attempt += 1;
      if (attempt === 1) throw new TypeError('Failed to fetch dynamically imported module');
      return signInSchema;
    });
    const typed = { email: 'not an address', password: '' };
    const said = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const first = await resolver(typed, undefined, options);
    expect(first).toEqual({ values: typed, errors: {} }); // the server's check (the same schema) answers instead
    expect(said).toHaveBeenCalledTimes(1); // and the failure is said, not swallowed
    said.mockRestore();
    const second = await resolver(typed, undefined, options);
    expect(Object.keys(second.errors).sort()).toEqual(['email', 'password']);
    expect(attempt).toBe(2);
  });

  it('a preload that fails is not kept: the next use loads again', async () => {
    let attempt = 0;
    const resolver = lazyZodResolver<SignInInput>(async () => {
      attempt += 1;
      if (attempt === 1) throw new TypeError('offline');
      return signInSchema;
    });
    resolver.preload();
    await new Promise((r) => setTimeout(r, 0));
    const result = await resolver({ email: '', password: '' }, undefined, options);
    expect(result.errors.email?.message).toBe('Enter your e-mail address.');
    expect(attempt).toBe(2);
  });
});
