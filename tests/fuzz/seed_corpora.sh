#!/usr/bin/env bash
# Seeds the corpora of the libFuzzer targets under CORPUS_ROOT (default build-fuzz/corpus):
#   step/         the STEP files of tests/data (with the fuzz findings of tests/data/fuzz), data/demo and
#                 tests/fuzz/seeds (frames whose members share no point: their texts split in two)
#   project/      the project files of data/demo and tests/fuzz/seeds
#   designation/  section designations as people type them
#   c_api/        a project, a NUL byte and a STEP file (fuzz_c_api_text's input)
set -euo pipefail
cd "$(dirname "$0")/../.."
corpus=${1:-build-fuzz/corpus}
mkdir -p "$corpus/step" "$corpus/project" "$corpus/designation" "$corpus/c_api"
cp tests/data/*.stp tests/data/fuzz/*.stp data/demo/*.stp tests/fuzz/seeds/*.stp "$corpus/step/"
cp data/demo/*.yaml tests/fuzz/seeds/*.yaml "$corpus/project/"
for d in IPE300 "HE 200 B" W12x26 "SHS 100x100x5" "CHS 219.1x8" PL20x300 L100x100x10 HSS6x6x3/8 W310x38.7 \
         "RHS 200x100x6.3" "CHS 219.1x8 HF" RD20 UPN200 "L 100x100x10" IPE300A; do
  printf '%s' "$d" > "$corpus/designation/$(printf '%s' "$d" | tr -c 'A-Za-z0-9' '_')"
done
pair() { cat "$1"; printf '\0'; cat "$2"; }
pair data/demo/platform.yaml data/demo/platform.stp > "$corpus/c_api/platform"
pair tests/fuzz/seeds/beam.yaml tests/data/beam_6m_ipe300_mm.stp > "$corpus/c_api/beam"
for step in tests/data/*.stp; do
  pair tests/fuzz/seeds/any.yaml "$step" > "$corpus/c_api/any_$(basename "$step" .stp)"
done
cp tests/fuzz/seeds/beam.yaml "$corpus/c_api/beam_text_only"
