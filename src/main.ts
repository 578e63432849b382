import '@fontsource/open-sans/400.css'
import '@fontsource/open-sans/600.css'
import '@fontsource/open-sans/700.css'
import 'element-plus/theme-chalk/el-message.css'
import 'element-plus/theme-chalk/el-message-box.css'
// The confirmations' backdrop: the shell's drawer and sign-in-again dialog, which brought it before, load on demand.
import 'element-plus/theme-chalk/el-overlay.css'
import './assets/theme.css'
import { createApp } from 'vue'
import { createPinia } from 'pinia'
import App from './App.vue'
import { vBusy } from './directives/vBusy'
import { i18n } from './i18n'
import { router } from './router'

const app = createApp(App)
app.use(createPinia())
app.use(i18n)
app.use(router)
app.directive('busy', vBusy)
// Shown once the first page's code, data and messages are in (the guard loads them side by side).
router.isReady().catch(() => undefined).then(() => app.mount('#app'))
