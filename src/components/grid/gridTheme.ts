// The data grids' look, one place for every grid: our palette and text colours (the same as the theme's
// CSS variables in src/assets/theme.css) and a system-safe font (the grid's default font would be
// fetched from the web).
import { themeQuartz } from 'ag-grid-community'

export const gridParams = {
  fontFamily: 'Open Sans',
  // In rem, so the grid's text grows with the browser's text size like the rest of the page.
  fontSize: '0.875rem',
  accentColor: '#14505c',
  foregroundColor: '#1d2b30',
  subtleTextColor: '#56656a',
  headerBackgroundColor: '#e5f4f3',
  headerTextColor: '#1d2b30',
  rowHoverColor: '#f0f8f7',
  borderColor: '#d5e2e3',
  inputBorder: { color: '#7b8a8e' },
} as const

export const gridTheme = themeQuartz.withParams(gridParams)
