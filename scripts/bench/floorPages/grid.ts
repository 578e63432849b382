import { createApp } from 'vue'
import Grid from './FloorGrid.vue'

createApp(Grid).mount('#app')
