import { describe, expect, it } from "vitest";
import { readConfig } from "../../server/config";

const base = { DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db", SESSION_SECRET: "x".repeat(32) };

describe("readConfig", () => {
  it("defaults to port 3000 on loopback, plain HTTP", () => {
    const config = readConfig(base);
    expect(config).toMatchObject({ port: 3000, host: "127.0.0.1", secureTransport: false, publicUrl: "http://127.0.0.1:3000" });
  });

  it("treats an https public address as secure transport", () => {
    expect(readConfig({ ...base, PUBLIC_URL: "https://fairweigh.example" }).secureTransport).toBe(true);
  });

  it("names every missing setting", () => {
    expect(() => readConfig({})).toThrow(/DATABASE_URL[\s\S]*SESSION_SECRET/);
  });
});
