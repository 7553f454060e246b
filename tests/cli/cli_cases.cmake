# Command-line checks: the built binary run as a user would. Each case names what it checks.
# cli_case(NAME EXPECT_EXIT ARGS...) runs coldcore and passes when its exit code matches.
function(cli_case name expect_exit)
  add_test(NAME cli.${name}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DEXPECT=${expect_exit}
                   "-DARGS=${ARGN}" -P ${PROJECT_SOURCE_DIR}/tests/cli/expect_exit.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
endfunction()

cli_case(version 0 --version)
cli_case(help 0 --help)
cli_case(unknown_verb 2 frobnicate)

# coldcore modes (foundation issue)
function(cli_expect name expect_exit)
  cmake_parse_arguments(C "" "" "ARGS;STDOUT_HAS;STDERR_HAS" ${ARGN})
  add_test(NAME cli.${name}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DEXPECT=${expect_exit}
                   "-DARGS=${C_ARGS}" "-DSTDOUT_HAS=${C_STDOUT_HAS}" "-DSTDERR_HAS=${C_STDERR_HAS}"
                   -P ${PROJECT_SOURCE_DIR}/tests/cli/expect_exit.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
endfunction()

# Sphere Bi = 1: zeta_1 = pi/2 exactly, C1 = 4/pi (REFERENCES 7 item 1, analytic).
cli_expect(modes_sphere_bi1_text 0 ARGS modes --shape sphere --biot 1 --count 3
           STDOUT_HAS "1.5707963267949" "1.27323954473516" "process authority")
cli_expect(modes_json_inf 0 ARGS modes --shape cylinder --biot inf --count 2 --format json
           STDOUT_HAS "\"shape\": \"cylinder\"" "\"biot\": \"inf\"" "\"zeta\": 2.404825557695773" "cautions")
cli_expect(modes_csv 0 ARGS modes --shape slab --biot 10 --format csv
           STDOUT_HAS "n,zeta,coefficient,mean_coefficient" "# caution:")
cli_expect(modes_bad_biot 2 ARGS modes --shape sphere --biot -3 STDERR_HAS "--biot = -3: must be >= 1e-6")
cli_expect(modes_bad_shape 2 ARGS modes --shape cube --biot 1 STDERR_HAS "--shape = cube: must be sphere, cylinder or slab")
cli_expect(modes_bad_count 2 ARGS modes --shape sphere --biot 1 --count 0 STDERR_HAS "--count = 0: must be from 1 to 2000")
cli_expect(modes_bad_format 2 ARGS modes --shape sphere --biot 1 --format html STDERR_HAS "--format = html: must be one of text|json|csv")
cli_expect(pending_verb 2 ARGS probe x.csv STDERR_HAS "not available yet")

# coldcore props: lean beef 74/22/3/1 at 20 °C -> k 0.517, rho 1056.3, cp 3609 J/kgK
# (REFERENCES 7 item 20, Choi & Okos 1986 evaluated independently).
cli_expect(props_lean_beef 0 ARGS props --composition water=0.74,protein=0.22,fat=0.03,ash=0.01 --from-C 20 --to-C 20 --format csv
           STDOUT_HAS "20,0.5169" "1056.2" "3609.3" "# caution:")
cli_expect(props_bad_sum 2 ARGS props --composition water=0.7 STDERR_HAS "composition sum = 0.7: must be 1 within 0.005")
cli_expect(props_bad_component 2 ARGS props --composition water=0.7,sugar=0.3 STDERR_HAS "--composition sugar: unknown component")

# coldcore solve: answers rounded to the safe side with a forward re-run beside them.
cli_expect(solve_hold_kofta_text 0 ARGS solve products/kofta-balls.toml --for hold-time
           STDOUT_HAS "stage:            combi-oven steam cook" "use:              14 min 00 s" "every target met"
                      "one unit less, at 13 min 00 s (780 s): NOT every target met" "process authority")
cli_expect(solve_hold_kofta_json 0 ARGS solve products/kofta-balls.toml --for hold-time --format json
           STDOUT_HAS "\"question\": \"hold-time\"" "\"stage\": \"combi-oven steam cook\"" "\"answer_s\": 812.00"
                      "\"rounded_s\": 840" "\"verification\"" "\"cautions\"")
cli_expect(solve_hold_kofta_csv 0 ARGS solve products/kofta-balls.toml --for hold-time --format csv
           STDOUT_HAS "# caution:" "# rounded_s (to use): 840" "rounded,840,listeria-monocytogenes,log-reduction,6,"
                      "one-unit-less,780,listeria-monocytogenes")
cli_expect(solve_chill_sausage 0 ARGS solve products/chicken-sausage-log.toml --for chill-time --format json
           STDOUT_HAS "\"question\": \"chill-time\"" "\"stage\": \"ice-water chill\"" "\"reached_at_rounded\": true")
cli_expect(solve_size_kofta 0 ARGS solve products/kofta-balls.toml --for max-size --format json
           STDOUT_HAS "\"question\": \"max-size\"" "\"quantity\": \"diameter\"" "\"rounded_m\": 0.054")
cli_expect(solve_medium_sausage 0 ARGS solve products/chicken-sausage-log.toml --for min-medium --format csv
           STDOUT_HAS "# rounded_C (to use): 62.5" "one-unit-less,62,salmonella-meat-poultry,log-reduction,7")
cli_expect(solve_no_solution 1 ARGS solve tests/cli/inverse/cold-medium.toml --for hold-time --max-hold-h 4
           STDERR_HAS "coldcore: no solution: no hold time of stage \"cook\" up to 4 h"
                      "so the centre can never reach it")
cli_expect(solve_bad_question 2 ARGS solve products/kofta-balls.toml --for cook-time
           STDERR_HAS "--for = cook-time: must be hold-time, chill-time, max-size or min-medium")
cli_expect(solve_bad_stage 2 ARGS solve products/kofta-balls.toml --for hold-time --stage oven
           STDERR_HAS "--stage = \"oven\": no such stage")

# coldcore deviation: the invented 8 C dip for 6 min in the corned beef retort hold.
cli_expect(deviation_corned_text 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412 --date 2026-12-01
           STDOUT_HAS "lot:                 CB-0412" "deviation start:     40 min 00 s" "lowest medium:       113.10 °C"
                      "medium log SHA-256:" "F scheduled 16.9 min, delivered 14.7 min" "Reviewer name:"
                      "is for the process authority to decide")
cli_expect(deviation_corned_json 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412 --format json
           STDOUT_HAS "\"scheduled_F_min\": 16.9" "\"delivered_F_min\": 14.7" "\"verdict\": \"met\""
                      "\"extra_hold_s\": 0" "\"disposition\"" "\"cautions\"")
cli_expect(deviation_corned_csv 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --format csv
           STDOUT_HAS "# caution:" "# disposition:" "target,kind,scheduled_F_min,delivered_F_min" "F0,F-value,16.9")
cli_expect(deviation_probe_kofta 0 ARGS deviation products/kofta-balls.toml --probe-log products/logs/kofta-probe.csv
           STDOUT_HAS "measured probe" "process authority")
cli_expect(deviation_nothing 2 ARGS deviation products/kofta-balls.toml
           STDERR_HAS "give --medium-log LOG.csv and/or --probe-log LOG.csv")

# coldcore media: the h ranges with their sources.
cli_expect(media_text 0 ARGS media STDOUT_HAS "condensing-steam" "5000 - 100000" "source:" "CAUTIONS")
cli_expect(media_json 0 ARGS media --format json STDOUT_HAS "\"key\": \"blast-chill\"" "\"h_min_W_m2K\": 20" "\"cautions\"")
cli_expect(media_csv 0 ARGS media --format csv STDOUT_HAS "key,h_min_W_m2K,h_max_W_m2K" "still-air,5,15")

# --conservative: the worst case of [product.ranges] and h_range_W_m2K beside the nominal answer.
cli_expect(solve_conservative_kofta 0 ARGS solve products/kofta-balls.toml --for hold-time --conservative
           STDOUT_HAS "CONSERVATIVE (documented worst case" "diameter 40 mm (largest)" "initial 2 C (coldest, for heating)"
                      "driven by: stage \"combi-oven steam cook\" h 80 W/m2K (lowest)")
cli_expect(solve_conservative_sausage_json 0 ARGS solve products/chicken-sausage-log.toml --for chill-time --conservative --format json
           STDOUT_HAS "\"conservative\"" "initial 5 C (warmest, for chilling)" "\"driven_by\"")
cli_expect(solve_conservative_no_ranges 2 ARGS solve products/corned-beef-can.toml --for min-medium --conservative
           STDERR_HAS "--conservative: the file gives no range that applies to min-medium")
