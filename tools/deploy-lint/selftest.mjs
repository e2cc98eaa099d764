// Proves each checker of `npm run lint` bites: it breaks a copy of a real deployment file in one known way and
// expects the checker to refuse it (exit 1), and expects the real files to pass (exit 0).
//   node selftest.mjs
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

const here = path.dirname(fileURLToPath(import.meta.url));
const repo = path.join(here, "../..");
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "deploy-lint-"));
const bin = (name) => path.join(here, "node_modules/.bin", name);
const checkers = {
    kubernetes: (file) => [process.execPath, [path.join(here, "validate-k8s.mjs"), file]],
    compose: (file) => [bin("dclint"), [file, "--max-warnings", "0", "--color", "false"]],
    dockerfile: (file) => [bin("dockerlinter"), ["-f", file, "-e", "info"]],
};

// [checker, real file, what is broken, text replaced, replacement]
const breakages = [
    ["kubernetes", "deploy/k8s/api-deployment.yaml", "a misspelt top-level field", /^  replicas: 2$/m, "  replica: 2"],
    ["kubernetes", "deploy/k8s/api-deployment.yaml", "a misspelt field deep in the pod", "readOnlyRootFilesystem", "readOnlyRootFileSystem"],
    ["kubernetes", "deploy/k8s/api-hpa.yaml", "a string where the API wants an integer", "averageUtilization: 70", 'averageUtilization: "70%"'],
    ["kubernetes", "deploy/k8s/worker-deployment.yaml", "a missing required field", /^ *containerPort: 5180\n/m, ""],
    ["kubernetes", "deploy/k8s/api-service.yaml", "an unknown kind", /^kind: Service$/m, "kind: Servcie"],
    ["compose", "deploy/compose.yaml", "a misspelt service key", "    restart: unless-stopped", "    restrat: unless-stopped"],
    ["compose", "deploy/compose.yaml", "a condition that does not exist", "condition: service_healthy", "condition: service_helthy"],
    ["dockerfile", "Dockerfile", "a misspelt instruction", /^EXPOSE /m, "EXPOSES "],
    ["dockerfile", "Dockerfile", "shell-form CMD", /^ENTRYPOINT \[.*\]$/m, "ENTRYPOINT dotnet SafetyMirror.Api.dll"],
];

const run = (checker, file) => {
    const [command, args] = checkers[checker](file);
    return spawnSync(command, args, { encoding: "utf8" });
};

let failures = 0;
for (const checker of Object.keys(checkers)) {
    const real = { kubernetes: "deploy/k8s", compose: "deploy/compose.yaml", dockerfile: "Dockerfile" }[checker];
    const result = run(checker, path.join(repo, real));
    if (result.status !== 0) {
        failures++;
        console.error(`FAIL ${checker}: the real ${real} is refused:\n${result.stdout}${result.stderr}`);
    }
}

for (const [index, [checker, file, what, from, to]] of breakages.entries()) {
    const original = fs.readFileSync(path.join(repo, file), "utf8");
    const broken = original.replace(from, to);
    if (broken === original) throw new Error(`${file} no longer holds ${from}: update this breakage`);
    const copy = path.join(scratch, `${index}-${path.basename(file)}`);
    fs.writeFileSync(copy, broken);
    const result = run(checker, copy);
    if (result.status === 1) {
        console.log(`refused as expected: ${checker} checker, ${what} (${file})`);
    } else {
        failures++;
        console.error(`FAIL ${checker} accepted ${what} (${file}): exit ${result.status}\n${result.stdout}${result.stderr}`);
    }
}

fs.rmSync(scratch, { recursive: true, force: true });
console.log(`deploy-lint self-test: ${breakages.length} broken files, ${failures} checker failures.`);
process.exitCode = failures === 0 ? 0 : 1;
