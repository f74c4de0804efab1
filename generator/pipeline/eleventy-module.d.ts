/** The part of Eleventy 3's programmatic API the build uses (the package ships no types). */
declare module '@11ty/eleventy' {
  export interface EleventyUserConfig {
    addGlobalData(name: string, data: unknown): void;
    addFilter(name: string, filter: (...args: never[]) => unknown): void;
    addPassthroughCopy(paths: string | Record<string, string>): void;
    addWatchTarget(target: string): void;
    setServerOptions(options: Record<string, unknown>): void;
    setNunjucksEnvironmentOptions(options: Record<string, unknown>): void;
    setQuietMode(quiet: boolean): void;
  }

  export interface EleventyOptions {
    configPath?: string;
    quietMode?: boolean;
    runMode?: 'build' | 'serve' | 'watch';
    config?: (config: EleventyUserConfig) => void | Promise<void>;
  }

  export default class Eleventy {
    constructor(input?: string, output?: string, options?: EleventyOptions);
    write(): Promise<unknown>;
    disableLogger(): void;
    toJSON(): Promise<{ url: string; inputPath: string; outputPath: string; content: string }[]>;
    serve(port?: number): Promise<void>;
    watch(): Promise<void>;
    stopWatch(): Promise<void>;
  }
}
