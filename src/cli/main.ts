#!/usr/bin/env node
import { processIo } from "./CliIo.js";
import { runCli } from "./runCli.js";

process.exitCode = await runCli(process.argv.slice(2), processIo);
