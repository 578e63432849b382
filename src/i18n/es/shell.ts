export default {
  areas: { home: 'Inicio', stock: 'Existencias', warehouse: 'Almacén', counter: 'Mostrador', purchasing: 'Compras', admin: 'Administración' },
  profile: 'Mi perfil',
  signOut: 'Cerrar sesión',
  signedOut: 'Sesión cerrada.',
  sessionEnded: 'Su sesión terminó. Vuelva a iniciar sesión.',
  greeting: 'Hola, {name}',
  yourAreas: 'Sus áreas',
  open: 'Abrir',
  outage: {
    title: 'Lumenyard no puede comunicarse con su base de datos en este momento.',
    retrying: 'Esta página vuelve a leer sola en cuanto se restablezca.',
    notSaved: 'Lo que acaba de guardar no se registró: envíelo de nuevo cuando desaparezca este aviso.',
  },
}
