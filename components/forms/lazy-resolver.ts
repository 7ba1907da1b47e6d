import type { FieldValues, Resolver } from 'react-hook-form';
import type { ZodType } from 'zod';

export type LazyResolver<T extends FieldValues> = Resolver<T> & {
  /** Starts loading the schema and the validation library (a form calls it when it is first focused). */
  preload: () => void;
};

/**
 * A react-hook-form resolver whose zod schema, with zod itself, loads the first time it is needed rather than
 * with the page: the account pages are public, and zod is most of their own code. The page's form is drawn and
 * usable at once; `preload` on first focus hides the wait, and a submit before it arrives waits for it. If the
 * code cannot be fetched (the connection dropped), the form is sent unchecked and the server's own check (the
 * same schema) answers for each field; the next attempt tries the load again. The schema's output must have the
 * form's own shape (strings in, strings out), so that unchecked values are what the submit handler expects.
 *
 *   const resolver = lazyZodResolver<SignInInput>(() => import('@/lib/validations/user').then((m) => m.signInSchema));
 *   useForm<SignInInput>({ resolver });  <form onFocusCapture={resolver.preload}>
 */
export function lazyZodResolver<T extends FieldValues>(loadSchema: () => Promise<ZodType<T, T>>): LazyResolver<T> {
  let ready: Promise<Resolver<T>> | null = null;
  const load = (): Promise<Resolver<T>> => {
    ready ??= Promise.all([import('@hookform/resolvers/zod'), loadSchema()])
      .then(([{ zodResolver }, schema]) => zodResolver(schema))
      .catch((err: unknown) => {
        ready = null;
        throw err;
      });
    return ready;
  };
  const resolver: Resolver<T> = async (values, context, options) => {
    let check: Resolver<T>;
    try {
      check = await load();
    } catch (err) {
      // Said in the console, so a loader that is broken (not just offline) is seen rather than silently unchecked.
      console.error('The form’s checks could not be loaded; sending it for the server to check.', err);
      return { values, errors: {} };
    }
    return check(values, context, options);
  };
  return Object.assign(resolver, { preload: () => void load().catch(() => undefined) });
}
