/**
 * Builds the Excel add-in into dist/:
 *   functions.js    the cell functions (src/functions/functions.ts re-exports the topic files), with
 *                   CustomFunctions.associate calls added by the metadata plugin to each topic file
 *   functions.json  their metadata, generated from the JSDoc of the topic files (scripts/function-files.mjs)
 *   taskpane.html   the task pane page, which is also the shared runtime: it loads Office.js, functions.js and
 *                   taskpane.js
 *   summary.html    the one-page summary, which the pane opens in an Office dialog (same origin): Office.js and
 *                   summary.js
 *   assets/*.png    the icons the manifest names
 *
 * `npm run build` (production) never touches certificates; only `webpack serve` (npm run dev-server) asks
 * office-addin-dev-certs for the https localhost certificate that Office needs.
 *
 * The export is a list of configurations so that another bundle (the browser preview host, src/preview/) can be
 * added as its own entry in that list, built with `commonConfig` but without the metadata plugin.
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import CopyWebpackPlugin from "copy-webpack-plugin";
import CustomFunctionsMetadataPlugin from "custom-functions-metadata-plugin";
import HtmlWebpackPlugin from "html-webpack-plugin";
import webpack from "webpack";
import { functionFiles, shippedMetadata } from "./scripts/function-files.mjs";

const root = path.dirname(fileURLToPath(import.meta.url));
export const DEV_SERVER_PORT = 3000;
/** The add-in's functions entry: re-exports every topic file of src/functions/. */
const FUNCTIONS_ENTRY = "./src/functions/functions.ts";

/**
 * What every bundle of the project shares: TypeScript through ts-loader (type checking is `npm run typecheck`), and
 * source maps as separate .map files in every mode. Never an eval-* devtool: those wrap each module in eval(), and
 * the pages' Content-Security-Policies (taskpane.html, src/preview/index.html) have no 'unsafe-eval', so such a
 * bundle stops at its first module (test/security/bundles.test.ts builds the development bundles to check this).
 */
export function commonConfig(mode) {
  const production = mode === "production";
  return {
    mode,
    context: root,
    devtool: "source-map",
    resolve: { extensions: [".ts", ".js"] },
    module: {
      rules: [
        {
          test: /\.ts$/,
          exclude: /node_modules/,
          use: { loader: "ts-loader", options: { transpileOnly: true } },
        },
      ],
    },
    performance: { hints: production ? "warning" : false },
  };
}

/**
 * Rewrites the functions.json the metadata plugin emitted into the metadata the add-in ships (shippedMetadata in
 * scripts/function-files.mjs: without allowCustomDataForDataTypeAny, which the generator always writes).
 */
class ShippedMetadataPlugin {
  apply(compiler) {
    compiler.hooks.thisCompilation.tap("ShippedMetadataPlugin", (compilation) => {
      compilation.hooks.processAssets.tap(
        { name: "ShippedMetadataPlugin", stage: webpack.Compilation.PROCESS_ASSETS_STAGE_ADDITIONS },
        () => {
          const asset = compilation.getAsset("functions.json");
          if (!asset) return;
          const json = shippedMetadata(asset.source.source().toString());
          compilation.updateAsset("functions.json", new webpack.sources.RawSource(json));
        },
      );
    });
  }
}

/** The add-in itself: cell functions, task pane page (= shared runtime) and icons. */
export function addinConfig(mode) {
  return {
    ...commonConfig(mode),
    name: "addin",
    entry: {
      functions: FUNCTIONS_ENTRY,
      taskpane: "./src/taskpane/taskpane.ts",
      summary: "./src/summary/summary.ts",
    },
    output: {
      path: path.join(root, "dist"),
      filename: "[name].js",
      // Other configurations write under dist/preview/; leave that to them.
      clean: { keep: /^preview\// },
    },
    plugins: [
      // First, as the templates have it: it generates functions.json and adds the associate calls to functions.ts.
      // It reads every file that holds a @customfunction (the topic files): one list shared with the tests.
      new CustomFunctionsMetadataPlugin({ output: "functions.json", input: functionFiles() }),
      new ShippedMetadataPlugin(),
      new HtmlWebpackPlugin({
        filename: "taskpane.html",
        template: "./src/taskpane/taskpane.html",
        // The shared runtime page runs both bundles; Office.js is loaded by the template itself, before them.
        chunks: ["functions", "taskpane"],
        chunksSortMode: "manual",
      }),
      // The summary's dialog page: its own bundle, beside the pane's page so that it shares its origin.
      new HtmlWebpackPlugin({ filename: "summary.html", template: "./src/summary/summary.html", chunks: ["summary"] }),
      new CopyWebpackPlugin({ patterns: [{ from: "assets/*.png", to: "assets/[name][ext]" }] }),
    ],
  };
}

/**
 * The local preview host that `npm start` serves (src/preview/): the estimate workbook in a grid over HyperFormula,
 * with the task pane beside it, into dist/preview/. Built WITHOUT the custom-functions metadata plugin (it reads the
 * functions.json the add-in build writes to dist/); HyperFormula (GPL-3.0) and ExcelJS belong to this bundle alone,
 * ExcelJS in a chunk of its own that loads when a file is opened or saved.
 */
export function previewConfig(mode) {
  return {
    ...commonConfig(mode),
    name: "preview",
    entry: { preview: "./src/preview/main.ts" },
    output: {
      path: path.join(root, "dist", "preview"),
      filename: "[name].js",
      chunkFilename: "[name].[contenthash:8].js",
      clean: true,
    },
    plugins: [
      new HtmlWebpackPlugin({ filename: "index.html", template: "./src/preview/index.html", chunks: ["preview"] }),
      new CopyWebpackPlugin({
        patterns: [
          { from: "src/preview/preview.css", to: "preview.css" },
          { from: "samples/*.xlsx", to: "samples/[name][ext]" },
          { from: "samples/index.json", to: "samples/index.json" },
        ],
      }),
    ],
    // a local page: the engine and the file library are large by nature
    performance: { hints: false },
  };
}

export default async function config(env = {}, argv = {}) {
  const mode = argv.mode ?? "production";
  const addin = addinConfig(mode);
  if (env.WEBPACK_SERVE) {
    // Only when serving: this may create and install a localhost certificate (see DEVELOPERS.md).
    const { default: devCerts } = await import("office-addin-dev-certs");
    addin.devServer = {
      port: DEV_SERVER_PORT,
      host: "localhost",
      hot: false,
      headers: { "Access-Control-Allow-Origin": "*" },
      server: { type: "https", options: await devCerts.getHttpsServerOptions() },
    };
  }
  return env.WEBPACK_SERVE ? [addin] : [addin, previewConfig(mode)];
}
