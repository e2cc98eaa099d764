// A client we did not write: its types come from openapi/openapi.json through openapi-typescript, and it calls a
// running service with fetch. If the document stops describing what the service does, this fails to compile or
// its checks fail.
// Usage: node out/check.js BASE_URL CASE, CASE one of: demo-evaluation, bad-request, no-key
import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { paths } from "./generated/safetymirror";

type Evaluate = paths["/v1/evaluations"]["post"];
type EvaluationRequest = Evaluate["requestBody"]["content"]["application/json"];
type Evaluation = Evaluate["responses"][200]["content"]["application/json"];
type ValidationProblem = Evaluate["responses"][400]["content"]["application/problem+json"];
type RecommendationRequest = paths["/v1/recommendations"]["post"]["requestBody"]["content"]["application/json"];

const examples = join(__dirname, "..", "..", "..", "..", "openapi", "examples");
const example = <T>(name: string): T => JSON.parse(readFileSync(join(examples, name), "utf8")) as T;

interface Answer<T> {
  status: number;
  contentType: string;
  body: T;
}

async function post<T>(base: string, path: string, request: unknown): Promise<Answer<T>> {
  const response = await fetch(new URL(path, base), {
    method: "POST",
    headers: { "Content-Type": "application/json", Accept: "application/json" },
    body: JSON.stringify(request),
  });
  const contentType = response.headers.get("content-type") ?? "";
  const text = await response.text();
  return { status: response.status, contentType, body: (text ? JSON.parse(text) : null) as T };
}

function expect(condition: boolean, what: string, answer: Answer<unknown>): void {
  if (!condition) {
    throw new Error(`${what}; the service answered ${answer.status} ${answer.contentType}: ${JSON.stringify(answer.body).slice(0, 600)}`);
  }
}

const cases: Record<string, (base: string) => Promise<string>> = {
  // The demo corner: 200 with the decision and its sentence.
  "demo-evaluation": async (base) => {
    const answer = await post<Evaluation>(base, "/v1/evaluations", example<EvaluationRequest>("demo-corner-local.json"));
    expect(answer.status === 200, "expected 200", answer);
    expect(typeof answer.body.decision === "string" && answer.body.decision.length > 0, "expected a decision", answer);
    expect(typeof answer.body.summary === "string" && answer.body.summary.length > 0, "expected a summary", answer);
    return `200, decision ${answer.body.decision}`;
  },
  // A mirror radius out of range: a 400 problem that names the field.
  "bad-request": async (base) => {
    const request = example<EvaluationRequest>("demo-corner-local.json");
    request.mirror = { ...request.mirror!, radiusM: -1 };
    const answer = await post<ValidationProblem>(base, "/v1/evaluations", request);
    expect(answer.status === 400, "expected 400", answer);
    expect(answer.contentType.startsWith("application/problem+json"), "expected problem details", answer);
    expect(Object.keys(answer.body.errors ?? {}).includes("mirror.radiusM"), "expected the problem to name mirror.radiusM", answer);
    return "400, names mirror.radiusM";
  },
  // A recommendation costs: without an API key a production service refuses it with a 401 problem.
  "no-key": async (base) => {
    const answer = await post<{ status?: number; title?: string }>(base, "/v1/recommendations", example<RecommendationRequest>("demo-recommendation-local.json"));
    expect(answer.status === 401, "expected 401", answer);
    expect(answer.contentType.startsWith("application/problem+json"), "expected problem details", answer);
    expect(answer.body.status === 401 && !!answer.body.title, "expected a problem with status 401 and a title", answer);
    return "401 problem";
  },
};

async function main(): Promise<void> {
  const [base, name] = process.argv.slice(2);
  const check = name === undefined ? undefined : cases[name];
  if (base === undefined || check === undefined) {
    throw new Error(`Usage: node out/check.js BASE_URL CASE, CASE one of: ${Object.keys(cases).join(", ")}`);
  }

  console.log(`${name}: ${await check(base)}`);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
