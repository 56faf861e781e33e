/** Types for make-icons.mjs (the icon drawing), used by the tests. */
export declare const ICON_SIZES: number[];
/** RGBA pixels of the icon at `size` × `size`, row-major, 4 bytes a pixel. */
export declare function renderIcon(size: number): Uint8Array;
/** The PNG encoding of `renderIcon(size)`. */
export declare function encodeIcon(size: number): Buffer;
export declare function decodePng(file: string): { width: number; height: number; data: Uint8Array };
export declare function iconPath(size: number, dir?: string): string;
