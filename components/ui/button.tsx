import Link from 'next/link';
import type { ButtonHTMLAttributes, ComponentProps } from 'react';

type Tone = 'primary' | 'quiet' | 'danger';

const tones: Record<Tone, string> = {
  primary: 'bg-dye text-on-accent hover:bg-dye-2',
  quiet: 'border border-rule bg-card text-graphite hover:bg-paper-2',
  danger: 'border border-bad bg-bad-soft text-bad hover:bg-bad hover:text-on-accent',
};

// Big targets: these get pressed at the machine, sometimes with an oily finger.
const base =
  'inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold no-underline transition-colors disabled:cursor-not-allowed disabled:opacity-60';

export function Button({ tone = 'primary', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: Tone }) {
  return <button className={`${base} ${tones[tone]} ${className}`} {...props} />;
}

// A link drawn as a control does nothing on paper either: it is left off in print, like a button.
export function ButtonLink({ tone = 'primary', className = '', ...props }: ComponentProps<typeof Link> & { tone?: Tone }) {
  return <Link data-control="" className={`${base} ${tones[tone]} ${className}`} {...props} />;
}
