import { createApp } from 'vue';
import { createPinia } from 'pinia';
import App from './App.vue';
import './styles/base.css';
import { startTheme } from './theme-mode';
import { useChartTheme } from './components/charts/theme';
import { engine } from './transport';

startTheme();
// The chart colours, read from the CSS once now, while the page is still empty (see `useChartTheme`).
useChartTheme();
// Start the engine (the Web Worker in the preview) now, so it loads while the app mounts.
engine();

createApp(App).use(createPinia()).mount('#app');
