export const navLink = 'inline-flex min-h-11 items-center whitespace-nowrap rounded-md px-3 text-sm font-semibold text-graphite no-underline hover:bg-paper-2';
