import { createApp } from 'vue';
import App from './App.vue';
import './styles/fonts.css';
import './styles/base.css';
import { pinia } from './plugins/pinia';
import { createBrowserRouter } from './plugins/router';

const app = createApp(App);
app.use(pinia);
app.use(createBrowserRouter(app, pinia));
app.mount('#app');
