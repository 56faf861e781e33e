/** Types for manifest-check.mjs (the offline manifest check), used by the tests. */
export interface Finding {
  /** Short kind of finding, e.g. "order", "resid-unknown", "url-https". */
  code: string;
  /** One line saying what is wrong and what is allowed. */
  message: string;
  /** Element path, e.g. "OfficeApp/VersionOverrides/Resources"; empty for whole-document findings. */
  at: string;
}
export interface CheckOptions {
  /** Folder holding the icon files (default: the repository's assets/). */
  assetsDir?: string;
  /** Origin of the development server (default https://localhost:3000). */
  devOrigin?: string;
  /** Files the build writes at the top of dist/ (default BUILD_OUTPUTS). */
  buildOutputs?: string[];
  /** When given, every dev-server file the manifest names must exist in this folder. */
  distDir?: string;
}
export declare const BUILD_OUTPUTS: string[];
export declare const DEFAULT_OPTIONS: Required<Omit<CheckOptions, "distDir">> & { distDir: string | undefined };
export declare const RESID_MAX: number;
export declare const SHORT_STRING_MAX: number;
export declare const LONG_STRING_MAX: number;
export declare function checkManifest(xml: string, options?: CheckOptions): Finding[];
export declare function pngSize(file: string): { width: number; height: number } | null;
