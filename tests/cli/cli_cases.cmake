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
  cmake_parse_arguments(C "" "" "ARGS;STDOUT_HAS;STDERR_HAS;STDOUT_LACKS" ${ARGN})
  add_test(NAME cli.${name}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DEXPECT=${expect_exit}
                   "-DARGS=${C_ARGS}" "-DSTDOUT_HAS=${C_STDOUT_HAS}" "-DSTDERR_HAS=${C_STDERR_HAS}"
                   "-DSTDOUT_LACKS=${C_STDOUT_LACKS}"
                   -P ${PROJECT_SOURCE_DIR}/tests/cli/expect_exit.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
endfunction()

# Sphere Bi = 1: zeta_1 = pi/2 exactly, C1 = 4/pi (REFERENCES 7 item 1, analytic).
cli_expect(modes_sphere_bi1_text 0 ARGS modes --shape sphere --biot 1 --count 3
           STDOUT_HAS "1.5707963267949" "1.27323954473516" "process authority")
cli_expect(modes_json_inf 0 ARGS modes --shape cylinder --biot inf --count 2 --format json
           STDOUT_HAS "\"shape\": \"cylinder\"" "\"biot_infinite\": true" "\"biot\": null" "\"schema_version\": 1" "\"zeta\": 2.404825557695773" "cautions")
cli_expect(modes_csv 0 ARGS modes --shape slab --biot 10 --format csv --csv-comments
           STDOUT_HAS "n,zeta,coefficient,mean_coefficient" "# caution:")
cli_expect(modes_bad_biot 2 ARGS modes --shape sphere --biot -3 STDERR_HAS "--biot = -3: must be >= 1e-6")
cli_expect(modes_bad_shape 2 ARGS modes --shape cube --biot 1 STDERR_HAS "--shape = cube: must be sphere, cylinder or slab")
cli_expect(modes_bad_count 2 ARGS modes --shape sphere --biot 1 --count 0 STDERR_HAS "--count = 0: must be from 1 to 2000")
cli_expect(modes_bad_format 2 ARGS modes --shape sphere --biot 1 --format html STDERR_HAS "--format = html: must be one of text|json|csv")

# coldcore props: lean beef 74/22/3/1 at 20 °C -> k 0.517, rho 1056.3, cp 3609 J/kgK
# (REFERENCES 7 item 20, Choi & Okos 1986 evaluated independently).
cli_expect(props_lean_beef 0 ARGS props --composition water=0.74,protein=0.22,fat=0.03,ash=0.01 --from-C 20 --to-C 20 --format csv --csv-comments
           STDOUT_HAS "20,0.5169" "1056.2" "3609.3" "# caution:")
cli_expect(props_bad_sum 2 ARGS props --composition water=0.7 STDERR_HAS "composition sum = 0.7: must be 1 within 0.005")
cli_expect(props_bad_component 2 ARGS props --composition water=0.7,sugar=0.3 STDERR_HAS "--composition sugar: unknown component")

# coldcore solve: answers rounded to the safe side with a forward re-run beside them.
cli_expect(solve_hold_kofta_text 0 ARGS solve products/kofta-balls.toml --for hold-time
           STDOUT_HAS "stage:            combi-oven steam cook" "use:              14 min 00 s" "every target met"
                      "one unit less, at 13 min 00 s (780 s): NOT every target met" "process authority")
cli_expect(solve_hold_kofta_json 0 ARGS solve products/kofta-balls.toml --for hold-time --format json
           STDOUT_HAS "\"question\": \"hold-time\"" "\"stage\": \"combi-oven steam cook\"" "\"answer_s\": 812.01"
                      "\"rounded_s\": 840" "\"verification\"" "\"cautions\"")
cli_expect(solve_hold_kofta_csv 0 ARGS solve products/kofta-balls.toml --for hold-time --format csv --csv-comments
           STDOUT_HAS "# caution:" "# rounded_s (to use): 840" "rounded,840,listeria-monocytogenes,log-reduction,6,"
                      "one-unit-less,780,listeria-monocytogenes")
cli_expect(solve_chill_sausage 0 ARGS solve products/chicken-sausage-log.toml --for chill-time --format json
           STDOUT_HAS "\"question\": \"chill-time\"" "\"stage\": \"ice-water chill\"" "\"reached_at_rounded\": true")
cli_expect(solve_size_kofta 0 ARGS solve products/kofta-balls.toml --for max-size --format json
           STDOUT_HAS "\"question\": \"max-size\"" "\"quantity\": \"diameter\"" "\"rounded_m\": 0.054")
cli_expect(solve_medium_sausage 0 ARGS solve products/chicken-sausage-log.toml --for min-medium --format csv --csv-comments
           STDOUT_HAS "# rounded_C (to use): 62.5" "one-unit-less,62,salmonella-meat-poultry,log-reduction,7")
cli_expect(solve_no_solution 1 ARGS solve tests/cli/inverse/cold-medium.toml --for hold-time --max-hold-h 4
           STDERR_HAS "coldcore: no solution: no hold time of stage \"cook\" up to 4 h"
                      "so the centre can never reach it")
# Errors speak the unit asked for: the same refusal with --units F (70 C = 158 F, 75 C = 167 F), and
# the bound with its unit.
cli_expect(solve_no_solution_in_F 1 ARGS solve tests/cli/inverse/cold-medium.toml --for hold-time --max-hold-h 4
           --units F
           STDERR_HAS "at the bound 14400 s, core 75 not demonstrated"
                      "the stage's medium (at most 158 °F) is not above core 75's 167 °F")
cli_expect(solve_bad_question 2 ARGS solve products/kofta-balls.toml --for cook-time
           STDERR_HAS "--for = cook-time: must be hold-time, chill-time, max-size or min-medium")
cli_expect(solve_bad_stage 2 ARGS solve products/kofta-balls.toml --for hold-time --stage oven
           STDERR_HAS "--stage = \"oven\": no such stage")

# coldcore deviation: the invented 8 C dip for 6 min in the corned beef retort hold.
cli_expect(deviation_corned_text 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412 --date 2026-12-01
           STDOUT_HAS "lot:                 CB-0412"
                      "1. medium colder than scheduled in a stage that heats, 40 min 00 s to 46 min 00 s into the stage (2400-2760 s); lowest 113.10 °C at 2400 s, scheduled 121.10 °C (8.00 K colder)"
                      "medium log SHA-256:" "F scheduled 16.9 min, delivered 14.7 min" "Reviewed by (process authority):"
                      "is for the process authority to decide")
cli_expect(deviation_corned_json 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412 --format json
           STDOUT_HAS "\"scheduled_F_min\": 16.9" "\"delivered_F_min\": 14.7" "\"verdict\": \"met\""
                      "\"extra_hold_s\": 0" "\"disposition\"" "\"cautions\"")
cli_expect(deviation_corned_csv 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --format csv --csv-comments
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
           STDOUT_HAS "CONSERVATIVE (documented worst case" "diameter 40 mm (largest)" "initial 2 °C (coldest, for heating)"
                      "driven by: stage \"combi-oven steam cook\" h 80 W/m2K (lowest)")
cli_expect(solve_conservative_sausage_json 0 ARGS solve products/chicken-sausage-log.toml --for chill-time --conservative --format json
           STDOUT_HAS "\"conservative\"" "initial 5 °C (warmest, for chilling)" "\"driven_by\"")
cli_expect(solve_conservative_no_ranges 2 ARGS solve products/corned-beef-can.toml --for min-medium --conservative
           STDERR_HAS "--conservative: the file gives no range that applies to min-medium")

# --units F reaches temperatures inside free text too (choice labels, notes, cooling-step labels):
# 2 °C = 35.6 °F (°F = °C x 9/5 + 32); the FSIS option-1 steps are set in °F (USDA FSIS Appendix B)
# and read back as 130 -> 80 -> 40 °F.
cli_expect(solve_conservative_kofta_units_f 0 ARGS solve products/kofta-balls.toml --for hold-time --conservative --units F
           STDOUT_HAS "initial 35.6 °F (coldest, for heating)" STDOUT_LACKS "°C")
cli_expect(run_sausage_units_f_labels 0 ARGS run products/chicken-sausage-log.toml --units F
           STDOUT_HAS "130 °F -> 80 °F" "80 °F -> 40 °F" STDOUT_LACKS "°C")
cli_expect(run_sausage_units_f_json 0 ARGS run products/chicken-sausage-log.toml --units F --format json
           STDOUT_HAS "130 °F -> 80 °F" "80 °F -> 40 °F" STDOUT_LACKS "°C")
# deviation --conservative: the deviation again at the worst case of the ranges, and its driver.
cli_expect(deviation_conservative_kofta 0 ARGS deviation products/kofta-balls.toml
           --medium-log products/logs/kofta-oven-deviation.csv --conservative
           STDOUT_HAS "CONSERVATIVE (documented worst case" "diameter 40 mm (largest)" "initial 2 °C (coldest, for heating)"
                      "the deviated stage \"combi-oven steam cook\" heats" "driven by: " "every target met as delivered, worst case: yes")
cli_expect(deviation_conservative_kofta_json 0 ARGS deviation products/kofta-balls.toml
           --medium-log products/logs/kofta-oven-deviation.csv --conservative --format json
           STDOUT_HAS "\"conservative\": {" "\"driven_by\"" "\"alone\"" "\"initial_reason\"")
# Invented: the nominal deviation meets F 100 min, the worst case (40 mm, 2 C) does not: exit 1.
cli_expect(deviation_conservative_not_met 1 ARGS deviation tests/cli/media-split/chill-credited-tight.toml
           --medium-log tests/cli/media-split/chill-credited-log.csv --stage cook --conservative --format csv --csv-comments
           STDOUT_HAS "# conservative driven by: diameter 40 mm (largest)" "# conservative all met as delivered: no"
                      "delivered_log_reduction,verdict,case" ",met,nominal" ",not demonstrated,conservative")
cli_expect(deviation_conservative_not_met_html 1 ARGS deviation tests/cli/media-split/chill-credited-tight.toml
           --medium-log tests/cli/media-split/chill-credited-log.csv --stage cook --conservative --format html
           STDOUT_HAS "Conservative evaluation (documented worst case of the file&#39;s ranges)"
                      "Driven by: diameter 40 mm (largest)." "worst case: NO" "choice alone")
cli_expect(deviation_conservative_no_ranges 2 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --conservative
           STDERR_HAS "--conservative: the file gives no range that applies to the deviation")
cli_expect(deviation_conservative_probe_only 2 ARGS deviation products/kofta-balls.toml
           --probe-log products/logs/kofta-probe.csv --conservative
           STDERR_HAS "deviation --conservative: needs --medium-log")

# medium_type per target (invented product, tests/cli/media-split/): lethality credited in the chill
# at the chill's HIGH h, the cooling rule at its LOW h, said in every verb and format.
cli_expect(media_split_run_text 0 ARGS run tests/cli/media-split/chill-credited.toml
           STDOUT_HAS "P70: h used: stage \"blast chill\": h 60 W/m2K, the high end of 20-60"
                      "two-stage-6h: h used: stage \"blast chill\": h 20 W/m2K, the low end of 20-60"
                      "evaluated on 2 scenarios")
cli_expect(media_split_run_csv 0 ARGS run tests/cli/media-split/chill-credited.toml --format csv --csv-comments
           STDOUT_HAS "# verdict note: P70: h used: stage \"blast chill\": h 60 W/m2K")
cli_expect(media_split_run_json 0 ARGS run tests/cli/media-split/chill-credited.toml --format json
           STDOUT_HAS "h per target: stage \\\"blast chill\\\": h 20 W/m2K")
cli_expect(media_split_solve 0 ARGS solve tests/cli/media-split/chill-credited.toml --for hold-time
           STDOUT_HAS "evaluated on 2 scenarios" "the result is the least favourable over them")
cli_expect(media_split_deviation 0 ARGS deviation tests/cli/media-split/chill-credited.toml
           --medium-log tests/cli/media-split/chill-credited-log.csv --stage cook
           STDOUT_HAS "h per target: stage \"blast chill\": h 60 W/m2K, the high end")
cli_expect(media_footnote 0 ARGS media STDOUT_HAS "the HIGH end in a cooling stage for the lethality")
# issue 11, defect 6: each verdict names its scenario and every scenario's history is shown, in
# every format (P70 at the chill's high end 60 W/m²K, the rule at its low end 20 W/m²K, h_ends.hpp).
cli_expect(issue11_scenarios_text 0 ARGS run tests/cli/media-split/chill-credited.toml
           STDOUT_HAS "  scenario 1: \"blast chill\" h 60 W/m²K (high end); targets: P70\n"
                      "  scenario 2: \"blast chill\" h 20 W/m²K (low end); targets: two-stage-6h\n"
                      "two-stage-6h: verdict from scenario 2")
cli_expect(issue11_scenarios_csv 0 ARGS run tests/cli/media-split/chill-credited.toml --format csv --csv-comments
           STDOUT_HAS "\nscenario,time_s,medium_C,centre_C,surface_C,mean_C,F_P70_min,lumped_centre_C\n1,0,96,4,4,4,0,4\n"
                      "\n2,0,96,4,4,4,,\n"
                      ", from scenario 2: \"blast chill\" h 20 W/m²K (low end)\n")
cli_expect(issue11_scenarios_json 0 ARGS run tests/cli/media-split/chill-credited.toml --format json
           STDOUT_HAS "\"scenarios\": " "\"scenario\": \"scenario 1: " "h 60 W/m²K (high end)\""
                      "\"scenario\": \"scenario 2: " "h 20 W/m²K (low end)\"")
cli_expect(issue11_scenarios_solve_html 0 ARGS solve tests/cli/media-split/chill-credited.toml --for hold-time --format html
           STDOUT_HAS "id=\"figure-scenario1-lethality\"" "id=\"figure-scenario2-cooling\"")
cli_expect(issue11_scenarios_html 0 ARGS run tests/cli/media-split/chill-credited.toml --format html
           STDOUT_HAS "id=\"figure-scenario1-lethality\"" "id=\"figure-scenario2-cooling\"" "<th>scenario</th>")

# Bad product files: refused by `coldcore run` with exit 2 and the exact message on their first line.
file(GLOB COLDCORE_BAD_FILES ${PROJECT_SOURCE_DIR}/tests/cli/bad/*.toml)
foreach(f IN LISTS COLDCORE_BAD_FILES)
  get_filename_component(n ${f} NAME_WE)
  file(RELATIVE_PATH rel ${PROJECT_SOURCE_DIR} ${f})
  add_test(NAME cli.bad.${n}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DFILE=${rel} -P ${PROJECT_SOURCE_DIR}/tests/cli/bad_file.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
endforeach()

# coldcore run on every demo product, in every format: cautions always present.
foreach(p kofta-balls chicken-sausage-log corned-beef-can lasagne-tray)
  foreach(fmt text json csv html)
    cli_expect(run_${p}_${fmt} 0 ARGS run products/${p}.toml --format ${fmt} --date 2026-12-01
               STDOUT_HAS "process authority" "heat-penetration" "temperature-distribution" "regulator")
  endforeach()
endforeach()
cli_expect(run_units_F 0 ARGS run products/kofta-balls.toml --format csv --units F --date 2026-12-01
           STDOUT_HAS "time_s,stage,medium_F,centre_F,surface_F,mean_F,F_listeria-monocytogenes_min" "\n0,combi-oven steam cook,204.8,39.2,39.2,39.2,0")
# run and probe name the data libraries they read in their provenance, with the SHA-256 that
# CMake's own file(SHA256) computes (FIPS 180-4).
file(SHA256 ${PROJECT_SOURCE_DIR}/products/organisms.toml organisms_sha)
file(SHA256 ${PROJECT_SOURCE_DIR}/products/cooling-rules.toml rules_sha)
file(SHA256 ${PROJECT_SOURCE_DIR}/products/cooking-tables.toml cooking_sha)
cli_expect(run_library_provenance 0 ARGS run products/kofta-balls.toml --date 2026-12-01
           STDOUT_HAS "organisms: products/organisms.toml (SHA-256 ${organisms_sha})"
                      "cooling rules: products/cooling-rules.toml (SHA-256 ${rules_sha})"
                      "cooking tables: products/cooking-tables.toml (SHA-256 ${cooking_sha})\n  date: 2026-12-01")
cli_expect(probe_library_provenance 0 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogenes
           --target-log 6 --format json --date 2026-12-01
           STDOUT_HAS "\"organisms\": \"organisms.toml (SHA-256 ${organisms_sha})\""
                      "\"cooling_rules\": \"cooling-rules.toml (SHA-256 ${rules_sha})\"")
cli_expect(run_md_needs_out 2 ARGS run products/kofta-balls.toml --format md STDERR_HAS "give --out PATH.md")
cli_expect(run_missing_file 2 ARGS run products/no-such-file.toml
           STDERR_HAS "products/no-such-file.toml: cannot read file: No such file or directory")
# issue 18: a directory or a device given as a file is refused before reading, with what to give.
cli_expect(run_directory_as_file 2 ARGS run products STDERR_HAS "products: cannot read file: it is a directory; give a regular file")
cli_expect(probe_device_as_log 2 ARGS probe /dev/zero --organism listeria-monocytogenes
           STDERR_HAS "/dev/zero: cannot read file: it is a device; give a regular file")
cli_expect(run_bad_step 2 ARGS run products/kofta-balls.toml --step-s -5 STDERR_HAS "--step-s: -5: must be from 0.1 to 31622400 s")
# A chill that cannot reach its end temperature within the cap is reported and exits 1.
cli_expect(run_cap_reached 1 ARGS run tests/cli/cap_reached.toml
           STDOUT_HAS "CAP REACHED" STDERR_HAS "reached its cap")

# coldcore probe on the shipped invented log (General Method; trapezoid and Simpson shown).
cli_expect(probe_kofta 0 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogenes --target-log 6 --rule two-stage-6h
           STDOUT_HAS "trapezoid" "Simpson" "met" "process authority")
cli_expect(probe_json 0 ARGS probe products/logs/kofta-probe.csv --reference-C 70 --z-C 7.5 --F-min 2 --format json
           STDOUT_HAS "\"verdict\": \"met\"" "cautions")
# (the log delivers F70 ≈ 870 min; a required 5000 min is not met. A log target over 100 is refused.)
cli_expect(probe_not_demonstrated 1 ARGS probe products/logs/kofta-probe.csv --reference-C 70 --z-C 7.5 --F-min 5000
           STDOUT_HAS "not demonstrated")
cli_expect(probe_unknown_organism 2 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogens --target-log 6
           STDERR_HAS "did you mean 'listeria-monocytogenes'")
cli_expect(probe_nothing_asked 2 ARGS probe products/logs/kofta-probe.csv STDERR_HAS "give --organism KEY")

# issue 11, defect 4: probe without a target reports what was delivered and claims no verdict, in
# every format (constant 70 °C for 4 min: F70 = 4 min by the definition of F, 8 log10 with
# D70 = 0.5 min; invented log tests/cli/probe/constant-70C.csv). Exit 0: nothing was asked.
foreach(fmt text html)
  cli_expect(issue11_probe_no_target_${fmt} 0 ARGS probe tests/cli/probe/constant-70C.csv --reference-C 70 --z-C 7.5
             --D-min 0.5 --format ${fmt} --date 2026-12-01
             STDOUT_HAS "Delivered lethality (no target given: no verdict)" "F 4.00 min at 70.0 °C (z 7.50 °C), 8.00 log10"
             STDOUT_LACKS "not demonstrated" "none given" "F needed"
             STDERR_HAS "no target given (--target-log, or --F-min with own kinetics)")
endforeach()
cli_expect(issue11_probe_no_target_csv 0 ARGS probe tests/cli/probe/constant-70C.csv --reference-C 70 --z-C 7.5
           --D-min 0.5 --format csv --csv-comments --date 2026-12-01
           STDOUT_HAS "# delivered, no target given, no verdict: own: F 4.00 min at 70.0 °C (z 7.50 °C), 8.00 log10\n"
           STDOUT_LACKS "# verdict:" "not demonstrated" "none given" "F needed")
cli_expect(issue11_probe_no_target_json 0 ARGS probe tests/cli/probe/constant-70C.csv --reference-C 70 --z-C 7.5
           --D-min 0.5 --format json --date 2026-12-01
           STDOUT_HAS "\"assessment\": []" "\"verdict\": \"none: no target given\"" "\"F_min\": 4," "\"log_reduction\": 8"
           STDOUT_LACKS "not demonstrated" "none given" "F needed")
cli_expect(issue11_probe_no_target_organism 0 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogenes
           STDOUT_HAS "Delivered lethality (no target given: no verdict)" "listeria-monocytogenes: F 868 min at 70.0 °C"
           STDOUT_LACKS "not demonstrated" "none given" "F needed")
# own kinetics without a D value: the delivered F alone (this used to be refused as "F = 0 min")
cli_expect(issue11_probe_no_target_no_D 0 ARGS probe tests/cli/probe/constant-70C.csv --reference-C 70 --z-C 7.5
           STDOUT_HAS "Delivered lethality (no target given: no verdict)\n  own: F 4.00 min at 70.0 °C (z 7.50 °C)\n"
           STDOUT_LACKS "not demonstrated" "log10" "F needed")
# with a rule beside it, the rule alone carries a verdict (and the exit code)
cli_expect(issue11_probe_no_target_with_rule 0 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogenes
           --rule two-stage-6h
           STDOUT_HAS "Delivered lethality (no target given: no verdict)" "two-stage-6h" " met\n"
           STDOUT_LACKS "not demonstrated" "none given")
# issue 11, probe stumble: a report about measured data says measured, names the log, its lot and
# its clock time (2026-11-30T07:00:00+01:00 is 06:00:00 UTC), and never speaks of a model.
cli_expect(issue11_probe_measured_html 0 ARGS probe tests/cli/probe/constant-70C.csv --reference-C 70 --z-C 7.5
           --F-min 3 --lot L-2026-11-30-A --format html --date 2026-12-01
           STDOUT_HAS "coldcore probe: measured cold-spot log tests/cli/probe/constant-70C.csv, lot L-2026-11-30-A"
                      "Engineering estimate from a measured temperature log" "Measured log"
                      "2026-11-30 06:00:00 UTC" "measured by the probe" "time since the first reading, 2026-11-30 06:00:00 UTC (min)"
           STDOUT_LACKS "conduction model" "centre (cold spot), exact" "Biot" "mass-average")
# a cooling rule's steps on the log's clock: 57 °C crossed at 06:08:40 UTC by linear interpolation
# (70 -> 55 °C from 06:00 to 06:10, invented log tests/cli/probe/timestamped-cooling.csv); limits 2 h
# and 6 h (FDA Food Code 3-501.14, REFERENCES 2.2)
cli_expect(issue11_probe_rule_clock 0 ARGS probe tests/cli/probe/timestamped-cooling.csv --rule two-stage-6h --max-gap-s 600
           STDOUT_HAS "two-stage-6h: step 57 °C -> 21 °C: clock started 2026-11-30 06:08:40 UTC, deadline 2026-11-30 08:08:40 UTC"
                      "two-stage-6h: step 57 °C -> 5 °C: clock started 2026-11-30 06:08:40 UTC, deadline 2026-11-30 12:08:40 UTC")
cli_expect(issue11_probe_measured_csv 0 ARGS probe tests/cli/probe/constant-70C.csv --reference-C 70 --z-C 7.5
           --F-min 3 --lot L-2026-11-30-A --format csv --csv-comments --date 2026-12-01
           STDOUT_HAS "# lot: L-2026-11-30-A\n" "# first reading: 2026-11-30 06:00:00 UTC\n" "time_s,measured_C,F_own_min\n"
           STDOUT_LACKS "conduction model")

# The data libraries list their sources.
foreach(verb organisms rules)
  foreach(fmt text json csv)
    cli_expect(${verb}_${fmt} 0 ARGS ${verb} --format ${fmt} STDOUT_HAS "process authority")
  endforeach()
endforeach()
cli_expect(organisms_sources 0 ARGS organisms STDOUT_HAS "c-botulinum-proteolytic" "from memory" "REFERENCES")
# The Food Code writes its limits in both units (FDA Food Code 2022, 3-501.14): each shown as written (issue 16).
cli_expect(rules_food_code 0 ARGS rules STDOUT_HAS "two-stage-6h" "57 °C -> 21 °C within 2 h 00 min 00 s")
cli_expect(rules_food_code_F 0 ARGS rules --units F STDOUT_HAS "135 °F -> 70 °F within 2 h 00 min 00 s" "135 °F -> 41 °F within 6 h")
cli_expect(run_food_code_F 0 ARGS run products/kofta-balls.toml --units F STDOUT_HAS "(step 135 °F -> 70 °F)" STDOUT_LACKS "134.6")

# solve and deviation on every demo product, in every format this verb writes: cautions always.
foreach(p kofta-balls chicken-sausage-log corned-beef-can lasagne-tray)
  foreach(fmt text json csv)
    if(fmt STREQUAL "text")
      set(c "CAUTIONS")
    elseif(fmt STREQUAL "json")
      set(c "\"cautions\"")
    else()
      set(c "caution:")
    endif()
    cli_expect(solve_hold_${p}_${fmt} 0 ARGS solve products/${p}.toml --for hold-time --format ${fmt} STDOUT_HAS "${c}")
  endforeach()
endforeach()
set(COLDCORE_DEV_kofta-balls "products/logs/kofta-oven-deviation.csv")
set(COLDCORE_DEV_chicken-sausage-log "products/logs/chicken-sausage-bath-deviation.csv")
set(COLDCORE_DEV_lasagne-tray "products/logs/lasagne-oven-deviation.csv")
foreach(p kofta-balls chicken-sausage-log lasagne-tray)
  cli_expect(deviation_${p}_text 0 ARGS deviation products/${p}.toml --medium-log ${COLDCORE_DEV_${p}}
             STDOUT_HAS "DEVIATION RECORD" "1. medium colder than scheduled in a stage that heats" "is for the process authority to decide" "CAUTIONS")
  cli_expect(deviation_${p}_json 0 ARGS deviation products/${p}.toml --medium-log ${COLDCORE_DEV_${p}} --format json
             STDOUT_HAS "\"delivered_F_min\"" "\"disposition\"" "\"cautions\"")
  cli_expect(deviation_${p}_csv 0 ARGS deviation products/${p}.toml --medium-log ${COLDCORE_DEV_${p}} --format csv
             STDOUT_HAS "target,kind,scheduled_F_min" "disposition:" "caution:")
endforeach()
# The delivered-process example file runs forward like any product file.
cli_expect(run_corned_delivered 0 ARGS run products/corned-beef-can-delivered.toml
           STDOUT_HAS "corned-beef-hold-deviation.csv")

# The committed example reports are what the demo makes now (fixed date, byte-identical).
# Checked in the plain build only: the sanitizer build may differ in the last bits of a double.
if(NOT COLDCORE_SANITIZE)
  add_test(NAME cli.reports_current
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                   -P ${PROJECT_SOURCE_DIR}/tests/cli/reports_current.cmake)
endif()

# solve and deviation as md and html: the verdict rows, the disposition statement, --units F.
cli_expect(solve_hold_kofta_html 0 ARGS solve products/kofta-balls.toml --for hold-time --format html --date 2026-12-01
           STDOUT_HAS "<h1>coldcore solve --for hold-time: shortest hold time"
                      "Use 14 min 00 s (840 s) (rounded up to 1 min 00 s (60 s), toward the safe side)."
                      "Verification: forward re-run at 14 min 00 s (840 s)"
                      "<td>listeria-monocytogenes</td><td>log-reduction</td><td>6.00 log10</td>"
                      "<td class=\"verdict-met\">met</td>" "One unit less: re-run at 13 min 00 s (780 s)"
                      "<td class=\"verdict-not\">not demonstrated</td>" "<figure id=\"figure-lethality\">"
                      "<td>date</td><td>2026-12-01</td>" "id=\"cautions\"")
cli_expect(solve_chill_sausage_html 0 ARGS solve products/chicken-sausage-log.toml --for chill-time --format html
           STDOUT_HAS "(end temperature 4.00 °C: reached)" "(end temperature 4.00 °C: not reached)"
                      "The duration one rounding unit shorter")
cli_expect(solve_md_needs_out 2 ARGS solve products/kofta-balls.toml --for hold-time --format md
           STDERR_HAS "give --out PATH.md")
cli_expect(solve_min_medium_sausage_html_F 0 ARGS solve products/chicken-sausage-log.toml --for min-medium --format html
           --units F STDOUT_HAS "°F" "temperature (°F)" "rounded up to 0.90 °F")
# 113.1 °C (the log's lowest reading) = 235.58 °F, 121.1 °C = 249.98 °F, an 8 K drop = 14.40 °F
# (definition of the Fahrenheit scale).
cli_expect(deviation_corned_html_F 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412 --format html --units F
           STDOUT_HAS "<h1>coldcore deviation record: lot CB-0412"
                      "<td>deviation 1 of 1</td><td>medium colder than scheduled in a stage that heats, 40 min 00 s to 46 min 00 s into the stage (2400-2760 s); lowest 235.58 °F at 2400 s, scheduled 249.98 °F (14.40 °F colder)</td>"
                      "<td>medium log SHA-256</td>" "is for the process authority to decide" "<td>Reviewed by (process authority)</td>"
                      "<td class=\"line\"> </td>" "class=\"verdict-met\">met<" "temperature (°F)")
cli_expect(deviation_md_needs_out 2 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --format md STDERR_HAS "give --out PATH.md")
# Same input and --date: the same bytes, in the report and in every SVG beside it.
foreach(fmt md html)
  add_test(NAME cli.solve_same_bytes_${fmt}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DWORK=${CMAKE_BINARY_DIR} -DNAME=solve-${fmt}
                   -DOUT=answer.${fmt} "-DARGS=solve;products/kofta-balls.toml;--for;hold-time;--format;${fmt};--date;2026-12-01"
                   -P ${PROJECT_SOURCE_DIR}/tests/cli/same_bytes.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
  add_test(NAME cli.deviation_same_bytes_${fmt}
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DWORK=${CMAKE_BINARY_DIR} -DNAME=deviation-${fmt}
                   -DOUT=record.${fmt}
                   "-DARGS=deviation;products/kofta-balls.toml;--medium-log;products/logs/kofta-oven-deviation.csv;--format;${fmt};--date;2026-12-01"
                   -P ${PROJECT_SOURCE_DIR}/tests/cli/same_bytes.cmake
           WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
endforeach()

# A cooking time-temperature table as a target (FSIS Appendix A 7-log column, REFERENCES 1.4).
cli_expect(run_cooking_table 0 ARGS run products/chicken-sausage-log.toml
           STDOUT_HAS "fsis-appendix-a-7-log" "instant row reached")

# solve, deviation and media join the cautions walk below.
list(APPEND COLDCORE_CAUTION_CASES
     "solve|products/kofta-balls.toml --for hold-time|text,md,html,json,csv"
     "solve|products/kofta-balls.toml --for hold-time --conservative --units F|md,html"
     "deviation|products/kofta-balls.toml --medium-log products/logs/kofta-oven-deviation.csv|text,md,html,json,csv"
     "deviation|products/kofta-balls.toml --probe-log products/logs/kofta-probe.csv --units F|md,html"
     "media|-|text,json,csv")

# Every reporting verb in every format carries the cautions (one walk over verbs x formats).
add_test(NAME cli.cautions_every_verb_and_format
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 "-DEXTRA_CASES=${COLDCORE_CAUTION_CASES}" -P ${PROJECT_SOURCE_DIR}/tests/cli/cautions_all.cmake)

# A composition-only product is refused by the process verbs with a message saying what to do.
cli_expect(run_composition_only 2 ARGS run tests/cli/composition_only.toml
           STDERR_HAS "product.composition: run, solve and deviation need constant [product.properties]")

# issue 18: --out never overwrites an input (product file, log, library), never replaces a
# directory or a device, and a failed write leaves no partial file or temporary.
add_test(NAME cli.out_safety
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 -P ${PROJECT_SOURCE_DIR}/tests/cli/out_safety.cmake)
# issue 16: -o/-f, the format named by the --out extension, "-" for stdin/stdout, help VERB,
# "did you mean" for options, --library on every verb that reads a library.
add_test(NAME cli.habits
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 -P ${PROJECT_SOURCE_DIR}/tests/cli/habits.cmake)
# issue 16: a can in US customary units: 307 x 409 is 3 7/16 by 4 9/16 in = 87.3 by 115.9 mm
# (can makers' notation, common practice; 1 in = 25.4 mm), 0.26 Btu/(h ft F) = 0.4500 W/(m K)
# (NIST SP 811 factor 1.730735).
cli_expect(run_us_units_can 1 ARGS run tests/cli/us-units/can-us.toml --date 2026-12-01
           STDOUT_HAS "diameter 87.3 mm, length 115.9 mm" "conductivity k: 0.4500 W/m·K" "initial temperature: 21.11 °C")
# issue 13/18: --conservative on 1 and 3 threads gives the same bytes.
add_test(NAME cli.threads_same_bytes
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 -P ${PROJECT_SOURCE_DIR}/tests/cli/threads.cmake)
cli_expect(solve_threads_range 2 ARGS solve products/kofta-balls.toml --for hold-time --conservative --threads 1000
           STDERR_HAS "--threads")
# issue 13: a progress line on stderr, only when it is a terminal (script(1) gives it one).
find_program(COLDCORE_SCRIPT_TOOL script)
if(COLDCORE_SCRIPT_TOOL)
  add_test(NAME cli.progress_line
           COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                   -DSCRIPT=${COLDCORE_SCRIPT_TOOL} -P ${PROJECT_SOURCE_DIR}/tests/cli/progress.cmake)
else()
  message(STATUS "script(1) not found: cli.progress_line not added")
endif()
# issue 11: a gap in a product's own medium log is named and credits no lethality (every format).
foreach(fmt text json csv html)
  cli_expect(run_medium_log_gap_${fmt} 0 ARGS run tests/cli/issue11-gaps/cook-gap.toml --format ${fmt} --date 2026-12-01
             STDOUT_HAS "no lethality credited across the gap in the log from 10.0 min to 25.0 min")
endforeach()
# issue 11 defect 6: the deviation record plots every h scenario's scheduled and delivered runs.
cli_expect(deviation_scenarios_plotted_html 0 ARGS deviation tests/cli/media-split/chill-credited.toml
           --medium-log tests/cli/media-split/chill-credited-log.csv --stage cook --format html --date 2026-12-01
           STDOUT_HAS "figure-scenario1-temperature" "figure-scenario1-lethality" "figure-scenario2-temperature"
                      "Scheduled against delivered temperatures (scenario 2)")
# issue 18: an impossible --date is refused with the accepted form (2026 is not a leap year).
cli_expect(run_bad_date 2 ARGS run products/kofta-balls.toml --date 2026-13-45
           STDERR_HAS "--date = 2026-13-45: must be a calendar date YYYY-MM-DD, e.g. 2026-12-01")
cli_expect(probe_bad_date 2 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogenes --date 2026-02-29
           STDERR_HAS "--date = 2026-02-29: must be a calendar date")
cli_expect(solve_leap_date 0 ARGS solve products/kofta-balls.toml --for hold-time --date 2028-02-29 STDOUT_HAS "2028-02-29")
# issue 18: numeric options are checked finite and in range (NaN used to run to exit 0/1, and a
# tiny --step-s looped until memory ran out).
cli_expect(probe_max_gap_nan 2 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogenes --max-gap-s nan
           STDERR_HAS "--max-gap-s: nan: must be greater than 0 and at most 31622400 s")
cli_expect(probe_reference_nan 2 ARGS probe products/logs/kofta-probe.csv --reference-C nan --z-C 7.5 --F-min 2
           STDERR_HAS "--reference-C: nan: must be from -200 to 400 C")
cli_expect(run_step_tiny 2 ARGS run products/kofta-balls.toml --format csv --step-s 1e-300
           STDERR_HAS "--step-s: 1e-300: must be from 0.1 to 31622400 s")
cli_expect(solve_round_inf 2 ARGS solve products/kofta-balls.toml --for hold-time --round-min inf
           STDERR_HAS "--round-min: inf: must be greater than 0 and at most 1440 min")
# issue 18: the rows of a history table are bounded, and the message says the --step-s to use.
cli_expect(run_step_too_many_rows 2 ARGS run tests/cli/long_hold.toml --format csv --step-s 0.1
           STDERR_HAS "rows over the" "at most 1000000 rows: give --step-s")
# issue 18: byte-identical output across working folders and time zones, every verb × format.
add_test(NAME cli.determinism_cwd_tz
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 -P ${PROJECT_SOURCE_DIR}/tests/cli/determinism.cmake)
set_tests_properties(cli.determinism_cwd_tz PROPERTIES TIMEOUT 600 COST 5000)  # started early under ctest -j

# issue 18: the bad-input suite (tests/bad_inputs/): over 100 bad files, logs, libraries, options
# and output paths, each refused with its exact message and exit code, without a crash, a hang,
# a partial or overwritten file. Prints the counts.
add_test(NAME bad_inputs.suite
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 -P ${PROJECT_SOURCE_DIR}/tests/bad_inputs/suite.cmake)
set_tests_properties(bad_inputs.suite PROPERTIES TIMEOUT 900)
# Issue 11, verdicts, margins and rounding (expected texts: tests/report/issue_11_verdict_test.cpp).
# Defect 2: the Food Code two-stage rule (REFERENCES 2.2) on a chill that hit its cap before 5 °C:
# the row carries step 2 (never reached), with no positive margin and the temperature reached.
cli_expect(issue11_cap_rule_text 1 ARGS run tests/cli/cap_rule.toml
           STDOUT_HAS "360 min (step 57 °C -> 5 °C)" "not reached (6.59 °C at the end)"
                      "none: not reached by the end of the process"
           STDOUT_LACKS "89.8 min")
cli_expect(issue11_cap_rule_json 1 ARGS run tests/cli/cap_rule.toml --format json
           STDOUT_HAS "\"margin_text\": \"none: not reached by the end of the process\"" "\"margin\": 0,"
                      "\"margin_uncertainty\": 0,")
cli_expect(issue11_cap_rule_csv 1 ARGS run tests/cli/cap_rule.toml --format csv --csv-comments
           STDOUT_HAS "# verdict: two-stage-6h: not demonstrated (required 360 min (step 57 °C -> 5 °C)"
                      "# verdict values: two-stage-6h: required 21600, achieved 6574.6" ", margin 0, margin_uncertainty 0 s")
# Defect 3: chill-time's one-unit-less re-run judged by the answer's own end condition (4 °C).
cli_expect(issue11_chill_less_json 0 ARGS solve products/chicken-sausage-log.toml --for chill-time --format json
           STDOUT_HAS "\"reached_at_one_unit_less\": false" "\"at_one_unit_less_C\": 4.03" "\"temperature_tolerance_K\": 1e-04")
cli_expect(issue11_chill_less_csv 0 ARGS solve products/chicken-sausage-log.toml --for chill-time --format csv --csv-comments
           STDOUT_HAS "# end at rounded: 3.87" "# end at one unit less: 4.03" ", not reached"
                      "run,value_s,target,kind,required,achieved,margin,unit,verdict,met,margin_uncertainty,end_temp_C,end_reached"
                      ",4.03869978356" ",false")
# Defect 7 and ties: 70 °C for exactly 123 s against F70 2.05 min (invented log, F = time exactly).
cli_expect(issue11_probe_tie 1 ARGS probe tests/cli/issue11/hold_70C_123s.csv --reference-C 70 --z-C 7.5 --F-min 2.05
           STDOUT_HAS "exactly at the required value" "exactly at the required value: not demonstrated by a positive margin"
           STDOUT_LACKS "met, margin" "0.000000000000000")
cli_expect(issue11_probe_tie_json 1 ARGS probe tests/cli/issue11/hold_70C_123s.csv --reference-C 70 --z-C 7.5 --F-min 2.05 --format json
           STDOUT_HAS "\"margin_uncertainty\": " "\"verdict\": \"not demonstrated\"")
# Meaningless log reductions: 70 °C for 20 h is 3600 log10 of L. monocytogenes by D70 = 20 s.
cli_expect(issue11_probe_huge_logs 0 ARGS probe tests/cli/issue11/hold_70C_20h.csv --organism listeria-monocytogenes --target-log 6
           STDOUT_HAS "more than 15 log10 (credited F 1200 min)" "more than 9.00 log10"
           STDOUT_LACKS "3600 log10" "3.60e+03")
# issue 11: deviations in both directions (invented logs under tests/cli/deviation/). Directions by the
# schedule (a stage heats when its medium is not below the stage before it); the unfavourable side is
# colder in a stage that heats, warmer in one that cools (common practice).
cli_expect(issue11_deviation_cook_colder_gap_short 0 ARGS deviation products/kofta-balls.toml
           --medium-log tests/cli/deviation/kofta-cook-short-gap.csv --date 2026-12-01
           STDOUT_HAS "deviated stage:      combi-oven steam cook (starts 0 s into the process; heats)"
                      "deviations:          3 (times from the stage start)"
                      "1. medium colder than scheduled in a stage that heats, 11 min 00 s to 13 min 00 s into the stage (660-780 s); lowest 88.00 °C at 660 s, scheduled 96.00 °C (8.00 K colder)"
                      "2. gap in the log of 5 min 00 s, 13 min 00 s to 18 min 00 s into the stage (780-1080 s): the medium meanwhile is unknown, and no lethality accrued in it is credited"
                      "3. stage shorter than scheduled by 1 min 00 s: the log ends 23 min 00 s into the stage (1380 s), the scheduled end is 24 min 00 s (1440 s)")
cli_expect(issue11_deviation_cook_csv 0 ARGS deviation products/kofta-balls.toml
           --medium-log tests/cli/deviation/kofta-cook-short-gap.csv --format csv --csv-comments
           STDOUT_HAS "# deviation: medium_colder; start_s 660; end_s 780; extreme_C 88; extreme_at_s 660; scheduled_at_extreme_C 96; departure_K 8"
                      "# deviation: log_gap; start_s 780; end_s 1080" "# deviation: stage_shortened; start_s 1380; end_s 1440")
cli_expect(issue11_deviation_chill_warmer 0 ARGS deviation products/kofta-balls.toml
           --medium-log tests/cli/deviation/kofta-chill-warm.csv --stage "blast chill" --date 2026-12-01
           STDOUT_HAS "deviated stage:      blast chill (starts 24 min 00 s into the process; cools)"
                      "1. medium warmer than scheduled in a stage that cools, 11 min 00 s to 20 min 00 s into the stage (660-1200 s); highest 10.00 °C at 660 s, scheduled -2.00 °C (12.00 K warmer)")
cli_expect(issue11_deviation_chill_json 0 ARGS deviation products/kofta-balls.toml
           --medium-log tests/cli/deviation/kofta-chill-warm.csv --stage "blast chill" --format json
           STDOUT_HAS "\"kind\": \"medium_warmer\"" "\"start_s\": 660" "\"end_s\": 1200" "\"extreme_C\": 10"
                      "\"scheduled_at_extreme_C\": -2" "\"departure_K\": 12" "\"stage_heats\": false")
# issue 11: an invented local-time log at 60 °C across a spring-forward change (30 real minutes):
# refused without --timezone; with it the jump is a gap and no lethality is credited across it.
cli_expect(issue11_probe_spring_forward_refused 2 ARGS probe tests/cli/deviation/spring-forward.csv
           --organism listeria-monocytogenes --target-log 6
           STDERR_HAS "spring-forward.csv:18: timestamp = \"2026-03-29T03:00:00\": jumps 3660 s after the previous row"
                      "this looks like a clock change (local time set forward), not an hour that elapsed; give the logger's fixed UTC offset, e.g. --timezone +01:00")
cli_expect(issue11_probe_spring_forward_timezone 1 ARGS probe tests/cli/deviation/spring-forward.csv
           --organism listeria-monocytogenes --target-log 6 --timezone +01:00
           STDOUT_HAS "no lethality credited across the gap in the log from 14.0 min to 75.0 min (longer than 60.0 s)"
                      "not demonstrated")
# issue 14: coldcore fit on the demo heat-penetration study, its calibrated product through run,
# solve and deviation, and the study's bad inputs (tests/cli/fit_study.cmake).
add_test(NAME cli.fit_study
         COMMAND ${CMAKE_COMMAND} -DEXE=$<TARGET_FILE:coldcore> -DSRC=${PROJECT_SOURCE_DIR} -DWORK=${CMAKE_BINARY_DIR}
                 -P ${PROJECT_SOURCE_DIR}/tests/cli/fit_study.cmake)
# About 4 min under the sanitizers (it ran last, alone): a COST makes `ctest -j` start it early.
set_tests_properties(cli.fit_study PROPERTIES COST 4000)

# issue 16: a decimal-comma spreadsheet export (';' separators, quoted headers holding a comma,
# °F in the header, a row-number column, one blank reading; invented log). Constant 158 °F = 70 °C
# for 4 min: F70 = 4 min by the definition of F (common practice). With the default 60 s limit the
# blank reading leaves no gap; with --max-gap-s 45 the 60 s around it is a gap, credited nothing:
# 3 min (the 1.5 to 2.5 min stretch removed, plain arithmetic).
set(export_args probe tests/cli/probe/export-semicolon.csv --time-column "Date Time, GMT+00:00" --reference-C 70
    --z-C 7.5 --D-min 0.5 --date 2026-12-01)
cli_expect(issue16_probe_export 0 ARGS ${export_args}
           STDOUT_HAS "F 4.00 min at 70.0 °C (z 7.50 °C), 8.00 log10" "first reading: 2026-11-30 06:00:00 UTC"
                      "export-semicolon.csv:11: \"Temp, °F\" is blank: the row is skipped")
cli_expect(issue16_probe_export_gap 0 ARGS ${export_args} --max-gap-s 45
           STDOUT_HAS "F 3.00 min at 70.0 °C (z 7.50 °C), 6.00 log10" "no lethality credited across the gap in the log from 1.50 min to 2.50 min")
cli_expect(issue16_probe_export_no_time_column 2 ARGS probe tests/cli/probe/export-semicolon.csv --reference-C 70 --z-C 7.5 --D-min 0.5
           STDERR_HAS "time column = \"#\": must be time_s, time_min, time_h (numbers) or timestamp (ISO-8601), or name the time column with --time-column NAME")
cli_expect(issue16_probe_bad_delimiter 2 ARGS ${export_args} --delimiter "|"
           STDERR_HAS "--delimiter = \"|\": must be , or ; or tab")

# issue 16: a deviation on a timestamped medium log gives each departure on the log's own clock
# too (invented log: the demo's dip at 2400-2760 s written from 2026-11-30 08:00:00 UTC, so
# 08:40:00 to 08:46:00 by arithmetic); a log without timestamps has no clock to show.
foreach(fmt text html json)
  cli_expect(issue16_deviation_clock_${fmt} 0 ARGS deviation products/corned-beef-can.toml
             --medium-log tests/cli/deviation/corned-beef-hold-clock.csv --lot CB-0412 --format ${fmt} --date 2026-12-01
             STDOUT_HAS "(clock 2026-11-30 08:40:00 UTC to 08:46:00 UTC)")
endforeach()
cli_expect(issue16_deviation_no_clock 0 ARGS deviation products/corned-beef-can.toml
           --medium-log products/logs/corned-beef-hold-deviation.csv --lot CB-0412 STDOUT_LACKS "(clock ")

# issue 16: the probe's three General Method sums as numbers, not only in a sentence (the
# sentence shows them rounded down: 875, 869, 868 min).
cli_expect(issue16_probe_general_method_json 0 ARGS probe products/logs/kofta-probe.csv --organism listeria-monocytogenes
           --target-log 6 --format json STDOUT_HAS "\"general_method\": {" "\"F_trapezoid_min\": 875." "\"F_simpson_min\": 869." "\"F_exact_linear_min\": 868.")
