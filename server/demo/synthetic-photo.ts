export * from "../../tests/analysis/support/synthetic";
