// Types for Comlink's Node adapter, which ships its declarations as node-adapter.d.ts
// beside an .mjs file (TypeScript looks for .d.mts there).
declare module 'comlink/dist/esm/node-adapter.mjs' {
  export { default } from 'comlink/dist/umd/node-adapter';
}
