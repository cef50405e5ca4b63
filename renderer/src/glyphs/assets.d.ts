// Vite turns `?inline` imports into a data: URL of the file (here: the bundled symbol font).
declare module '*.woff?inline' {
  const dataUrl: string;
  export default dataUrl;
}
