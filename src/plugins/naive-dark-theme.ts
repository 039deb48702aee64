// naive-ui's dark theme names the dark styles of every component, so it is its own chunk, fetched in dark mode only.
export { darkTheme } from 'naive-ui';
