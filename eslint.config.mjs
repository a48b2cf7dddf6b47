// Lint rules for the whole tree. Formatting belongs to Prettier (eslint-config-prettier turns off
// the rules that would fight it); this file keeps correctness and the project's boundaries.
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import prettier from "eslint-config-prettier";

/** Packages that carry a framework, a database, a network or a hosted service. */
const heavyPackages = [
  "next",
  "next/*",
  "next-auth",
  "next-auth/*",
  "react",
  "react-dom",
  "sequelize",
  "pg",
  "pg-boss",
  "socket.io",
  "socket.io-client",
  "@socket.io/*",
  "stripe",
  "nodemailer",
  "@aws-sdk/*",
];

/** Our own modules that reach the database, the mail or the processor. */
const dataLayers = ["**/models", "**/models/*", "**/lib/services/*", "**/lib/db/*", "**/lib/stripe/*", "**/lib/mail/*"];

const pureDomain = [
  "lib/auction/**",
  "lib/catalogue/**",
  "lib/disputes/**",
  "lib/lots/**",
  "lib/money/**",
  "lib/time/**",
  "lib/validation/**",
  "lib/valves/**",
];

const config = [
  {
    ignores: [
      ".next/**",
      "dist/**",
      "node_modules/**",
      ".data/**",
      "reports/**",
      "test-results/**",
      "playwright-report/**",
      "next-env.d.ts",
    ],
  },
  ...nextVitals,
  ...nextTs,
  prettier,
  {
    rules: {
      "import/no-cycle": ["error", { ignoreExternal: true }],
      // One file, one concern: past 400 lines a file is split along its seams.
      "max-lines": ["error", { max: 400, skipBlankLines: false, skipComments: false }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    // Domain logic is pure: no framework, database or service code.
    files: pureDomain,
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: heavyPackages, message: "The pure domain folders import no framework, database or service code." },
            { group: dataLayers, message: "The pure domain folders import no models or services." },
          ],
        },
      ],
    },
  },
  {
    // Components get their data from pages and routes; they never reach models or services at run time.
    files: ["components/**"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: dataLayers,
              allowTypeImports: true,
              message: "Components import no models or services at run time (type imports are fine).",
            },
          ],
        },
      ],
    },
  },
];

export default config;
