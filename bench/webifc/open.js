// Times web-ifc's OpenModel on one IFC file: a measuring tool for
// bench/compare.sh, not a dependency of swaygate.
//
// usage: node bench/webifc/open.js MODEL [RUNS]
// env:   WEBIFC_DIR  folder where web-ifc@0.0.78 is installed
//                     (default bench/out/webifc-0.0.78; see bench/webifc/install.sh)
//
// Prints one JSON line: file, bytes, instances (GetAllLines), and the open
// times in ms of each run (the first run includes the WebAssembly warm-up of
// the parser but not Init).
"use strict";
const fs = require("fs");
const path = require("path");

async function main() {
  const [file, runsArg] = process.argv.slice(2);
  if (!file) {
    console.error("usage: node open.js MODEL [RUNS]");
    process.exit(2);
  }
  const runs = Math.max(1, parseInt(runsArg || "1", 10));
  const dir = process.env.WEBIFC_DIR || path.join(__dirname, "..", "out", "webifc-0.0.78");
  const WebIFC = require(require.resolve("web-ifc", { paths: [dir] }));
  const api = new WebIFC.IfcAPI();
  await api.Init();
  const data = fs.readFileSync(file);
  const times = [];
  let instances = 0;
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    const id = api.OpenModel(data);
    const t1 = process.hrtime.bigint();
    times.push(Number(t1 - t0) / 1e6);
    if (i === 0) {
      instances = api.GetAllLines(id).size();
    }
    api.CloseModel(id);
  }
  const sorted = [...times].sort((a, b) => a - b);
  console.log(JSON.stringify({
    file, bytes: data.length, instances,
    open_ms: times.map((t) => Math.round(t * 10) / 10),
    min_ms: Math.round(sorted[0] * 10) / 10,
    median_ms: Math.round(sorted[Math.floor(sorted.length / 2)] * 10) / 10,
  }));
}

main().catch((e) => { console.error(e); process.exit(1); });
