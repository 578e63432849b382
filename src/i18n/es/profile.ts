export default {
  title: 'Mi perfil',
  locale: 'Idioma',
  english: 'English',
  spanish: 'Español',
}
