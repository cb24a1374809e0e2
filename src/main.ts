import { createApp } from 'vue';
import { createPinia } from 'pinia';
import { Quasar } from 'quasar';
import './boot/fonts.ts';
import 'quasar/src/css/index.sass';
import './css/app.sass';
import App from './App.vue';
import { quasarOptions } from './boot/quasar.ts';
import { createAppRouter } from './router/index.ts';

const app = createApp(App);
app.use(createPinia());
app.use(Quasar, quasarOptions);
app.use(createAppRouter());
app.mount('#app');
