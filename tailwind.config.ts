import type { Config } from 'tailwindcss';

// Combtrace's palette, defined once: warm paper, deep green ink for structure,
// one amber accent for the main action, and plain status colours that always come with a word.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f8f5ee', raised: '#fffdf8', sunk: '#efe9dc' },
        line: { DEFAULT: '#e0d8c8', strong: '#c8bda7' },
        ink: { DEFAULT: '#1d2a22', soft: '#4a5a50', faint: '#6b776f' },
        forest: { 50: '#eef4ef', 100: '#d6e6da', 600: '#2f5e45', 700: '#244a36', 800: '#1b3a2a', 900: '#132a1f' },
        amber: { 100: '#fbeccb', 400: '#e7ae3c', 500: '#d99a1e', 600: '#b97f0c', 800: '#6e4a05' },
        ok: { bg: '#e3f0e4', fg: '#1f5130' },
        warn: { bg: '#fbeccb', fg: '#6e4a05' },
        bad: { bg: '#f8e1dc', fg: '#8a2417' },
        info: { bg: '#e4ecf3', fg: '#23425c' },
      },
      fontFamily: {
        heading: ['Lora', 'Georgia', 'serif'],
        sans: ['Inter', 'system-ui', 'sans-serif'],
      },
      borderRadius: { card: '10px' },
    },
  },
};

export default config;
