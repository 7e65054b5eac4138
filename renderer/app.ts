/** The app: theme, chart colours, then Vue with Pinia mounted on #app (loaded by `main.ts`, after it has started the engine). */
import { createApp } from 'vue';
import { createPinia } from 'pinia';
import App from './App.vue';
import './styles/base.css';
import { startTheme } from './theme-mode';
import { useChartTheme } from './components/charts/theme';

startTheme();
// The chart colours, read from the CSS once now, while the page is still empty (see `useChartTheme`).
useChartTheme();

createApp(App).use(createPinia()).mount('#app');
