# Issue 11, "you can't see at a glance whether it passed": the verdict summary every report opens
# with, and the one stderr line of a verb writing to --out (included from CMakeLists.txt after
# cli_cases.cmake, whose cli_expect it uses). Inputs: products/ (invented demo) and
# tests/cli/summary/ (invented variants, see its README.md).

# stderr: the report's own sentence, then where it went (and nothing on stdout). Expected values:
# kofta-shortfall as scheduled credits F70 1780 min in the cook against 5000 min required
# (shortfall 3220 min, rounded up); with the oven log 683 min against 1000 min (shortfall 317 min).
cli_expect(summary_stderr_run_met 0 ARGS run products/kofta-balls.toml --format html
           --out ${CMAKE_BINARY_DIR}/summary_run_met.html
           STDERR_HAS "coldcore run: All 2 targets met; report written to ${CMAKE_BINARY_DIR}/summary_run_met.html\n"
           STDOUT_LACKS "Verdict summary")
cli_expect(summary_stderr_run_not 1 ARGS run tests/cli/summary/kofta-shortfall.toml --format csv
           --out ${CMAKE_BINARY_DIR}/summary_run_not.csv
           STDERR_HAS "coldcore run: 1 of 4 targets NOT DEMONSTRATED: F70-5000 (shortfall 3220 min); report written to ${CMAKE_BINARY_DIR}/summary_run_not.csv\n")
cli_expect(summary_stderr_run_none 0 ARGS run tests/cli/summary/no-target.toml --format text
           --out ${CMAKE_BINARY_DIR}/summary_run_none.txt
           STDERR_HAS "coldcore run: No target given: no verdict; report written to ${CMAKE_BINARY_DIR}/summary_run_none.txt\n")
cli_expect(summary_stderr_deviation_not 1 ARGS deviation tests/cli/summary/kofta-shortfall.toml
           --medium-log products/logs/kofta-oven-deviation.csv --format json --out ${CMAKE_BINARY_DIR}/summary_dev.json
           STDERR_HAS "coldcore deviation: As delivered: 2 of 4 targets NOT DEMONSTRATED: F70-1000 (shortfall 317 min), F70-5000 (shortfall 4320 min); report written to ${CMAKE_BINARY_DIR}/summary_dev.json\n")
# (a log target over 100 log10 is refused: an F70 of 5000 min, far over the log's ~870 min, is not met)
cli_expect(summary_stderr_probe_not 1 ARGS probe products/logs/kofta-probe.csv --reference-C 70 --z-C 7.5 --F-min 5000
           --rule two-stage-6h --format md --out ${CMAKE_BINARY_DIR}/summary_probe.md
           STDERR_HAS "coldcore probe: 1 of 2 targets NOT DEMONSTRATED: own (shortfall ")
cli_expect(summary_stderr_solve 0 ARGS solve products/kofta-balls.toml --for hold-time --format text
           --out ${CMAKE_BINARY_DIR}/summary_solve.txt
           STDERR_HAS "coldcore solve: At the answer to use: all 2 targets met; report written to ${CMAKE_BINARY_DIR}/summary_solve.txt\n")
# without --out the report goes to stdout and opens with the summary; no stderr line
cli_expect(summary_stdout_run_not 1 ARGS run tests/cli/summary/kofta-shortfall.toml
           STDOUT_HAS "coldcore run: Lamb kofta balls, 38 mm (invented test variant)\n\nVerdict summary: 1 of 4 targets NOT DEMONSTRATED: F70-5000 (shortfall 3220 min)\n\nProduct")

# The walk over verb x format (tests/cli/summary_walk.cmake says what it checks). Quick cases
# only (no --conservative solve: minutes each); every one runs in all five formats.
set(COLDCORE_SUMMARY_WALK
    "run-kofta|run|products/kofta-balls.toml"
    "run-sausage|run|products/chicken-sausage-log.toml"
    "run-corned|run|products/corned-beef-can.toml"
    "run-lasagne|run|products/lasagne-tray.toml"
    "run-shortfall|run|tests/cli/summary/kofta-shortfall.toml"
    "run-step-never|run|tests/cli/summary/chill-step-never.toml"
    "run-no-target|run|tests/cli/summary/no-target.toml"
    "run-cap|run|tests/cli/cap_reached.toml"
    "run-media-split|run|tests/cli/media-split/chill-credited.toml"
    "probe-met|probe|products/logs/kofta-probe.csv --organism listeria-monocytogenes --target-log 6 --rule two-stage-6h"
    "probe-not|probe|products/logs/kofta-probe.csv --reference-C 70 --z-C 7.5 --F-min 5000 --rule two-stage-6h"
    "probe-F|probe|products/logs/kofta-probe.csv --reference-C 70 --z-C 7.5 --F-min 2"
    "probe-no-requirement|probe|products/logs/kofta-probe.csv --reference-C 70 --z-C 7.5"
    "solve-hold-kofta|solve|products/kofta-balls.toml --for hold-time"
    "solve-chill-lasagne|solve|products/lasagne-tray.toml --for chill-time"
    "solve-size-kofta|solve|products/kofta-balls.toml --for max-size"
    "solve-chill-step-never|solve|tests/cli/summary/chill-step-never.toml --for chill-time --end-C 10"
    "deviation-kofta|deviation|products/kofta-balls.toml --medium-log products/logs/kofta-oven-deviation.csv"
    "deviation-lasagne|deviation|products/lasagne-tray.toml --medium-log products/logs/lasagne-oven-deviation.csv"
    "deviation-shortfall|deviation|tests/cli/summary/kofta-shortfall.toml --medium-log products/logs/kofta-oven-deviation.csv"
    "deviation-probe|deviation|products/kofta-balls.toml --probe-log products/logs/kofta-probe.csv"
    "deviation-tight-conservative|deviation|tests/cli/media-split/chill-credited-tight.toml --medium-log tests/cli/media-split/chill-credited-log.csv --stage cook --conservative")
# Failing here until the branches that fix them are merged (then remove them; the walk fails
# while a listed case passes): issue 11 defect 2 (a cooling step never reached shown with a
# positive margin) and defect 4 (probe without a requirement gives a verdict).
set(COLDCORE_SUMMARY_KNOWN "")
add_test(NAME cli.summary_walk_every_verb_and_format
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 "-DCASES=${COLDCORE_SUMMARY_WALK}" "-DKNOWN=${COLDCORE_SUMMARY_KNOWN}"
                 -P ${PROJECT_SOURCE_DIR}/tests/cli/summary_walk.cmake)
# The longest case (minutes under the sanitizers): a high COST makes `ctest -j` start it first,
# beside the short ones, instead of alone at the end.
set_tests_properties(cli.summary_walk_every_verb_and_format PROPERTIES COST 10000)
