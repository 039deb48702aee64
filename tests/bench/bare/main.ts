// The yardstick for `npm run bench:ui`: Vue and one naive-ui button, nothing else.
import { createApp } from 'vue';
import BareApp from './BareApp.vue';

createApp(BareApp).mount('#app');
