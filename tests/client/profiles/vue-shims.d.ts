// For `tsc -p tsconfig.node.json`, which type-checks tests without the Vue plugin: a .vue import
// is a component. The components themselves are checked by vue-tsc with tsconfig.app.json.
declare module '*.vue' {
  import type { DefineComponent } from 'vue'
  const component: DefineComponent<Record<string, unknown>, Record<string, unknown>, unknown>
  export default component
}
