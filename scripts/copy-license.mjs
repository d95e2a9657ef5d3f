#!/usr/bin/env node
// prepack of every package: the root LICENSE goes into the tarball. npm runs
// this in the package directory; the copy there is ignored by git, so the root
// file stays the only one to edit.
import { copyFileSync } from 'node:fs';

copyFileSync(new URL('../LICENSE', import.meta.url), 'LICENSE');
