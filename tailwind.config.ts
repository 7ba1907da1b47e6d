// Tailwind v4 reads its theme from app/globals.css (@theme); this file is loaded there with @config
// and holds what CSS alone cannot say: where class names are found.
import type { Config } from 'tailwindcss';

const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  darkMode: 'media',
};

export default config;
