import { createApp, h } from 'vue'
import { createPinia } from 'pinia'
import { createRouter, createWebHistory, RouterView } from 'vue-router'
import { createI18n } from 'vue-i18n'
import SignIn from './SignIn.vue'

const i18n = createI18n({ legacy: false, locale: 'en', messages: { en: { user: 'User name', password: 'Password', go: 'Sign in' } } })
const router = createRouter({ history: createWebHistory(), routes: [{ path: '/:any(.*)*', component: SignIn }] })
createApp({ render: () => h(RouterView) }).use(createPinia()).use(i18n).use(router).mount('#app')
