import { createApp } from 'vue';
import { createPinia } from 'pinia';
import App from './App.vue';
import './styles/base.css';
import { startTheme } from './theme-mode';

startTheme();

createApp(App).use(createPinia()).mount('#app');
