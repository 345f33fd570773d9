import { createApp } from 'vue'
import { createPinia } from 'pinia'
import ElementPlus from 'element-plus'
import 'element-plus/dist/index.css'
import '@fontsource/inter/latin-400.css'
import '@fontsource/inter/latin-600.css'
import App from './App.vue'
import { router } from './router/index'

createApp(App).use(createPinia()).use(router).use(ElementPlus).mount('#app')
