import { createApp } from 'vue';
import { createPinia } from 'pinia';
import App from './App.vue';
import './styles/base.css';
import { startTheme } from './theme-mode';
import { engine } from './transport';

startTheme();
// Start the engine (the Web Worker in the preview) now, so it loads while the app mounts.
engine();

createApp(App).use(createPinia()).mount('#app');
