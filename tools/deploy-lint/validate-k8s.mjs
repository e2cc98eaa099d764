// Validates Kubernetes manifests against the API of a pinned Kubernetes release, strictly: an unknown or misspelt
// field, a wrong type, a missing required field or an unknown kind fails the run.
//   node validate-k8s.mjs [file or folder ...]   (default: ../../deploy/k8s)
// Two readers, each generated from the official Kubernetes OpenAPI document:
//  - kubernetes-types (the API of Kubernetes 1.30 as TypeScript types), checked by the TypeScript compiler, whose
//    excess-property check refuses every field the API does not define, at any depth;
//  - kubernetes-models (its JSON schemas compiled with ajv), which checks formats and patterns as well.
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import ts from "typescript";
import { parseAllDocuments } from "yaml";

const here = path.dirname(fileURLToPath(import.meta.url));
const inputs = process.argv.length > 2 ? process.argv.slice(2) : [path.join(here, "../../deploy/k8s")];
const files = inputs.flatMap((input) => fs.statSync(input).isDirectory()
    ? fs.readdirSync(input).filter((name) => /\.ya?ml$/.test(name)).sort().map((name) => path.join(input, name))
    : [input]);

const problems = [];
const manifests = [];
for (const file of files) {
    for (const [index, document] of parseAllDocuments(fs.readFileSync(file, "utf8")).entries()) {
        const where = `${path.relative(process.cwd(), file)} (document ${index + 1})`;
        for (const error of [...document.errors, ...document.warnings]) problems.push(`${where}: ${error.message}`);
        const manifest = document.toJS();
        if (manifest === null) continue;
        if (typeof manifest.apiVersion !== "string" || typeof manifest.kind !== "string") {
            problems.push(`${where}: apiVersion and kind are required`);
            continue;
        }
        manifests.push({ where, manifest });
    }
}

// kubernetes-types names a group by its short name (apps, autoscaling, networking) and the core group "core".
const typesModule = (apiVersion) => {
    const [group, version] = apiVersion.includes("/") ? apiVersion.split("/") : ["core", apiVersion];
    return `kubernetes-types/${group.replace(/\.k8s\.io$/, "")}/${version}`;
};

// One TypeScript file: each manifest assigned to a constant of its kind's type.
const generated = path.join(here, ".generated", "manifests.ts");
fs.mkdirSync(path.dirname(generated), { recursive: true });
let source = "";
const spans = [];
for (const [i, { where, manifest }] of manifests.entries()) {
    const start = source.split("\n").length;
    source += `export const manifest${i}: import("${typesModule(manifest.apiVersion)}").${manifest.kind} = ${JSON.stringify(manifest, null, 2)};\n`;
    spans.push({ where, start, end: source.split("\n").length - 1 });
}
fs.writeFileSync(generated, source);

const program = ts.createProgram([generated], {
    strict: true, noEmit: true, skipLibCheck: true, types: [],
    module: ts.ModuleKind.ESNext, moduleResolution: ts.ModuleResolutionKind.Node10, target: ts.ScriptTarget.ES2022,
});
const lines = source.split("\n");
for (const diagnostic of ts.getPreEmitDiagnostics(program)) {
    const message = ts.flattenDiagnosticMessageText(diagnostic.messageText, " ");
    if (!diagnostic.file) { problems.push(message); continue; }
    const line = diagnostic.file.getLineAndCharacterOfPosition(diagnostic.start ?? 0).line + 1;
    const span = spans.find((s) => line >= s.start && line <= s.end);
    problems.push(`${span?.where ?? "generated"}: ${message}  [at: ${lines[line - 1].trim()}]`);
}

// The same manifests through kubernetes-models' compiled JSON schemas.
for (const { where, manifest } of manifests) {
    const group = manifest.apiVersion;
    try {
        const model = await import(`kubernetes-models/${group}/${manifest.kind}`);
        new model[manifest.kind](manifest).validate();
    } catch (error) {
        problems.push(`${where}: ${error.code === "ERR_MODULE_NOT_FOUND" ? `no kind ${manifest.kind} in ${group}` : error.message}`);
    }
}

for (const problem of problems) console.error(problem);
console.log(`Kubernetes manifests: ${manifests.length} checked in ${files.length} files, ${problems.length} problems.`);
process.exitCode = problems.length === 0 ? 0 : 1;
