export default {
  title: 'Mi perfil',
  weightUnit: 'Pesos en',
  pounds: 'Libras (lb)',
  kilograms: 'Kilogramos (kg)',
  locale: 'Idioma',
  english: 'English',
  spanish: 'Español',
}
