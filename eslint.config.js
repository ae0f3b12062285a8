import js from "@eslint/js";
import globals from "globals";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

const restrict = (patterns) => ["error", { patterns }];

export default tseslint.config(
  { ignores: ["dist/", "storage/", "node_modules/", "test-results/", "playwright-report/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-explicit-any": ["error", { ignoreRestArgs: true }],
    },
  },
  {
    files: ["migrations/**/*.ts"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { "react-hooks": reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      // The client never imports the server.
      "no-restricted-imports": restrict([{ group: ["**/server/**", "node:*"], message: "src/ must not import server code" }]),
    },
  },
  // Features never import another feature.
  ...["strips", "inks", "search", "binders", "stash", "review", "accounts", "catalogue", "notices", "dev-mail", "plan"].map((feature) => ({
    files: [`src/features/${feature}/**/*.{ts,tsx}`],
    rules: {
      "no-restricted-imports": restrict([
        { group: ["**/server/**", "node:*"], message: "src/ must not import server code" },
        { group: [`**/features/!(${feature})/**`], message: "features never import each other; compose them in a route" },
      ]),
    },
  })),
  {
    files: ["shared/**/*.ts"],
    rules: {
      "no-restricted-imports": restrict([{ group: ["**/server/**", "**/src/**", "node:*"], message: "shared/ imports neither client nor server" }]),
    },
  },
);
