/**
 * naive-ui pieces the Bench shows only in some states: the drawers of a narrow window and the notice of a plan
 * that could not be opened. A wide window that opens its plan never fetches them.
 */
import { defineAsyncComponent } from 'vue';

const kit = () => import('./occasional-kit');

export const NDrawer = defineAsyncComponent(() => kit().then((m) => m.NDrawer));
export const NDrawerContent = defineAsyncComponent(() => kit().then((m) => m.NDrawerContent));
export const NResult = defineAsyncComponent(() => kit().then((m) => m.NResult));
