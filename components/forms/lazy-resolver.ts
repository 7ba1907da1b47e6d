import type { FieldValues, Resolver } from 'react-hook-form';
import type { ZodType } from 'zod';

export type LazyResolver<T extends FieldValues, O> = Resolver<T, unknown, O> & {
  /** Starts loading the schema and the validation library (a form calls it when it is first focused). */
  preload: () => void;
};

/**
 * A react-hook-form resolver whose zod schema, with zod itself, loads the first time it is needed rather than
 * with the page: the account pages are public, and zod is most of their own code. The page's form is drawn and
 * usable at once; `preload` on first focus hides the wait, and a submit before it arrives waits for it. If the
 * code cannot be fetched (the connection dropped), the form is sent unchecked and the server's own check (the
 * same schema) answers for each field; the next attempt tries the load again.
 *
 *   const resolver = lazyZodResolver<SignInInput>(() => import('@/lib/validations/user').then((m) => m.signInSchema));
 *   useForm<SignInInput>({ resolver });  <form onFocusCapture={resolver.preload}>
 */
export function lazyZodResolver<T extends FieldValues, O = T>(loadSchema: () => Promise<ZodType<O, T>>): LazyResolver<T, O> {
  let ready: Promise<Resolver<T, unknown, O>> | null = null;
  const load = (): Promise<Resolver<T, unknown, O>> => {
    ready ??= Promise.all([import('@hookform/resolvers/zod'), loadSchema()])
      .then(([{ zodResolver }, schema]) => zodResolver(schema) as Resolver<T, unknown, O>)
      .catch((err: unknown) => {
        ready = null;
        throw err;
      });
    return ready;
  };
  const resolver: Resolver<T, unknown, O> = async (values, context, options) => {
    let check: Resolver<T, unknown, O>;
    try {
      check = await load();
    } catch {
      return { values: values as unknown as O, errors: {} };
    }
    return check(values, context, options);
  };
  return Object.assign(resolver, { preload: () => void load().catch(() => undefined) });
}
