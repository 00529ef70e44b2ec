import { createApp } from 'vue';
import { createPinia } from 'pinia';
import { Quasar, Dark, Dialog, Notify, LocalStorage } from 'quasar';

// Fonts and icons ship with the app (bundled by Vite): no request leaves it.
import '@quasar/extras/roboto-font/roboto-font.css';
import '@quasar/extras/material-icons/material-icons.css';
import 'quasar/src/css/index.sass';
import './css/app.scss';

import App from './App.vue';
import { router } from './router';

const app = createApp(App);
app.use(Quasar, { plugins: { Dark, Dialog, Notify, LocalStorage } });
app.use(createPinia());
app.use(router);
app.mount('#app');
