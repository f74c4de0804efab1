/** The part of Eleventy's watcher package (chokidar 4 with globs) that serve.ts uses; it ships no types. */
declare module '@11ty/chokidar-with-glob-support' {
  export interface WatchOptions {
    ignoreInitial?: boolean;
    ignored?: ((file: string) => boolean) | string | readonly string[];
  }
  export interface FSWatcher {
    on(event: 'all', listener: (event: string, file: string) => void): this;
    once(event: 'ready', listener: () => void): this;
    close(): Promise<void>;
  }
  export function watch(paths: string | readonly string[], options?: WatchOptions): FSWatcher;
}
