/*
 * pure-rand 8 publishes its modules through package.json "exports" only. The server compiles
 * with moduleResolution node10, which does not read "exports", so its types are mapped here to
 * the files behind them (Node itself resolves the "exports" at run time). The Angular app and
 * shared/ (moduleResolution bundler) resolve the package directly and never see this file.
 */
declare module 'pure-rand/generator/xoroshiro128plus' {
  export * from 'pure-rand/lib/generator/xoroshiro128plus';
}
declare module 'pure-rand/distribution/uniformInt' {
  export * from 'pure-rand/lib/distribution/uniformInt';
}
