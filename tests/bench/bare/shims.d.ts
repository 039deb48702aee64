// The bare page's one component, for the Node-side type check (the app's own check covers .vue files).
declare module '*.vue' {
  import type { DefineComponent } from 'vue';
  const component: DefineComponent;
  export default component;
}
