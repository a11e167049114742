// Client entry: fonts, styles, plugins, router.
import { createApp } from 'vue';
import '@fontsource/work-sans/400.css';
import '@fontsource/work-sans/500.css';
import '@fontsource/work-sans/600.css';
import '@fontsource/work-sans/700.css';
import 'primeicons/primeicons.css';
import './styles/app.css';
import App from './App.vue';
import { install as installPinia } from './plugins/pinia';
import { install as installPrimeVue } from './plugins/primevue';
import { router } from './router';
import { startFieldWork } from './offline/start-field-work';

const app = createApp(App);
installPinia(app);
installPrimeVue(app);
app.use(router);
startFieldWork();
app.mount('#app');
