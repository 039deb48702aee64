// naive-ui pieces the Bench shows only now and then (see lazy-kit.ts): in one chunk, fetched when one is shown.
export { NDrawer, NDrawerContent, NResult } from 'naive-ui';
