export default {
  title: 'Iniciar sesión en Lumenyard',
  username: 'Usuario',
  password: 'Contraseña',
  submit: 'Iniciar sesión',
  signingIn: 'Iniciando sesión…',
  intro: 'Existencias, cálculos de materiales, preparación de pedidos y compras para el patio de bloques de vidrio.',
  demoHint: 'Escenario de demostración: inicie sesión como admin, counter, warehouse, buyer o viewer con la contraseña brightcourse-demo.',
}
