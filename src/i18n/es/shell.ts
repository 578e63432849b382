export default {
  areas: { home: 'Inicio', stock: 'Existencias', warehouse: 'Almacén', counter: 'Mostrador', purchasing: 'Compras', admin: 'Administración' },
  profile: 'Mi perfil',
  signOut: 'Cerrar sesión',
  signedOut: 'Sesión cerrada.',
  sessionEnded: 'Su sesión terminó. Vuelva a iniciar sesión.',
  greeting: 'Hola, {name}',
  yourAreas: 'Sus áreas',
  open: 'Abrir',
}
