import type { Config } from 'tailwindcss'

// Veerline palette: deep teal "slate water" ground, paper surfaces, amber for caution, signal red for exceedance.
export default <Partial<Config>>{
  content: ['./components/**/*.vue', './layouts/**/*.vue', './pages/**/*.vue', './app.vue', './plugins/**/*.ts'],
  theme: {
    extend: {
      colors: {
        tide: { 50: '#eef6f5', 100: '#d5e9e6', 200: '#a9d2cc', 300: '#74b3aa', 400: '#46938a', 500: '#2d766e', 600: '#235e59', 700: '#1d4b48', 800: '#17393a', 900: '#0f2a2e', 950: '#081a1d' },
        paper: '#f7f5ef',
        ochre: { 100: '#fbefd2', 300: '#f1c96b', 500: '#d99a1c', 700: '#7a5207' },
        flare: { 100: '#fde2dc', 500: '#d8462b', 700: '#9c2a16' },
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
    },
  },
}
