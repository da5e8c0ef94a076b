/// <reference types="vite/client" />

/** The package version, defined at build time (renderer/vite.config.ts). */
declare const __TAGBENCH_VERSION__: string;

declare module 'plotly.js-dist-min' {
  import * as Plotly from 'plotly.js';
  export default Plotly;
}
