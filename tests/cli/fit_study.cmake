# issue 14: `coldcore fit` on the demo heat-penetration study (products/corned-beef-can-study.toml,
# logs made by the independent finite-volume generator tests/reference/gen_heat_penetration.py with
# the truth in tests/reference/heat_penetration/can_study_truth.csv) in every format, its
# --write-product file through run, solve (with the fit bound) and deviation, and the study's bad
# inputs. Run by ctest with -DEXE, -DSRC (source tree), -DWORK (scratch folder).
set(w ${WORK}/fit-study)
file(REMOVE_RECURSE ${w})
file(MAKE_DIRECTORY ${w})
set(study ${SRC}/products/corned-beef-can-study.toml)
set(probes ${SRC}/products/logs/can-study-probes.csv)
set(medium ${SRC}/products/logs/can-study-medium.csv)
set(lib --library ${SRC}/products)

include(${CMAKE_CURRENT_LIST_DIR}/run_helpers.cmake)

# JSON: the contract's keys; the design probe is the slowest container of the truth table
# (probe2, the smallest alpha factor, 0.93).
run_ok(json 0 fit ${study} --probe-log ${probes} --medium-log ${medium} ${lib} --format json --write-product cal.toml --date 2026-12-01)
foreach(key "\"alpha_m2_s\"" "\"alpha_ci95_m2_s\"" "\"h_W_m2K\"" "\"h_ci95_W_m2K\"" "\"h_lower_bound\"" "\"rms_K\""
            "\"n_points\": 241" "\"curves\"" "\"f_h_s\"" "\"j_h\"" "\"f_c_s\"" "\"j_c\"" "\"straight_from_s\""
            "\"straight_to_s\"" "\"broken\": false" "\"slowest_probe\": \"probe2_C\"" "\"cautions\"")
  must_have(json "${out}" "${key}")
endforeach()
# The fitted alpha of probe2 lies within 2 % of its truth 1.3118e-07 m2/s.
string(JSON alpha GET "${out}" fit alpha_m2_s)
if(alpha LESS 1.2856e-7 OR alpha GREATER 1.3380e-7)
  message(FATAL_ERROR "json: fit.alpha_m2_s = ${alpha}: not within 2 % of the truth 1.3118e-07")
endif()
string(JSON lo GET "${out}" fit alpha_ci95_m2_s 0)
string(JSON hi GET "${out}" fit alpha_ci95_m2_s 1)
if(lo GREATER 1.3118e-7 OR hi LESS 1.3118e-7)
  message(FATAL_ERROR "json: the 95 % interval [${lo}, ${hi}] misses the truth 1.3118e-07")
endif()

# Every format, on the quick sphere study (tests/cli/fit/sphere-study.toml against the finite-volume
# readings of tests/reference/heat_penetration/sphere_noisy.csv: one file holds the medium and the probe).
set(sphere ${SRC}/tests/cli/fit/sphere-study.toml --probe-log ${SRC}/tests/reference/heat_penetration/sphere_noisy.csv
    --probe-column centre_C --medium-log ${SRC}/tests/reference/heat_penetration/sphere_noisy.csv --medium-column medium_C
    ${lib} --date 2026-12-01)
foreach(fmt text html csv json)
  run_ok(${fmt} 0 fit ${sphere} --format ${fmt})
  must_have(${fmt} "${out}" "process authority")
endforeach()
# The truth (k 0.45 W/mK, h 150 W/m2K) lies inside the sphere fit's intervals.
string(JSON k GET "${out}" fit conductivity_W_mK)
string(JSON hlo GET "${out}" fit h 0 h_ci95_W_m2K 0)
string(JSON hhi GET "${out}" fit h 0 h_ci95_W_m2K 1)
if(k LESS 0.441 OR k GREATER 0.459 OR hlo GREATER 150 OR hhi LESS 150)
  message(FATAL_ERROR "sphere: k ${k} (truth 0.45, 2 %) or h interval [${hlo}, ${hhi}] (truth 150) wrong")
endif()
run_ok(md 0 fit ${sphere} --out fit.md)
foreach(f fit.md fit-fit.svg fit-semilog.svg fit-residuals.svg)
  if(NOT EXISTS ${w}/${f})
    message(FATAL_ERROR "md: ${f} was not written")
  endif()
endforeach()
run_ok(probe_column 2 fit ${SRC}/tests/cli/fit/sphere-study.toml --probe-log ${SRC}/tests/reference/heat_penetration/sphere_noisy.csv
       --probe-column nothing_C ${lib})
must_have(probe_column "${err}" "--probe-column names none of its temperature columns (medium_C, centre_C)")

# The calibrated product file runs through every verb unchanged. The study's own process (a 60 min
# hold) does not deliver F0 3 min at the slowest can (it delivered 1.44 min there): run says so
# (exit 1), and solve answers the hold that does.
run_ok(cal_run 1 run cal.toml ${lib})
must_have(cal_run "${out}" "at the 95 % bound of the fit")
run_ok(cal_solve 0 solve cal.toml --for hold-time ${lib} --format json)
must_have(cal_solve "${out}" "\"at_fit_bound\": {")
string(JSON nominal GET "${out}" rounded_s)
string(JSON bound GET "${out}" at_fit_bound rounded_s)
if(bound LESS nominal)
  message(FATAL_ERROR "cal_solve: the hold at the fit bound (${bound} s) is shorter than the nominal (${nominal} s)")
endif()
run_ok(cal_deviation_schedule 0 deviation cal.toml --medium-log ${SRC}/products/logs/corned-beef-hold-deviation.csv
       --stage "retort hold" ${lib})
# Another initial temperature of the same product from the same fit: the calibration checks k and h only.
file(READ ${w}/cal.toml text)
string(REPLACE "initial_C = 40" "initial_C = 20" text "${text}")
file(WRITE ${w}/cal-cold.toml "${text}")
run_ok(cal_other_initial 0 solve cal-cold.toml --for hold-time ${lib} --format json)
string(JSON cold GET "${out}" rounded_s)
if(NOT cold GREATER nominal)
  message(FATAL_ERROR "a colder fill (20 C) must need a longer hold than 40 C: ${cold} s against ${nominal} s")
endif()
# Editing the fitted k by hand is refused: the covariance would describe another product.
string(REGEX REPLACE "conductivity_W_mK = [0-9.e-]+\n" "conductivity_W_mK = 0.47\n" text "${text}")
file(WRITE ${w}/cal-edited.toml "${text}")
run_ok(cal_edited 2 run cal-edited.toml ${lib})
must_have(cal_edited "${err}" "calibration.alpha_m2_s")

# Bad inputs: a probe log outside the medium log's span; too few readings.
file(WRITE ${w}/short-medium.csv "time_s,medium_C\n0,40\n30,44\n60,48\n")
run_ok(outside 2 fit ${study} --probe-log ${probes} --medium-log short-medium.csv ${lib})
must_have(outside "${err}" "every probe reading must lie within the medium log")
file(WRITE ${w}/two.csv "time_s,probe_C\n0,40\n30,40.1\n")
run_ok(too_few 2 fit ${study} --probe-log two.csv ${lib})
must_have(too_few "${err}" "at least 3")
file(WRITE ${w}/back.csv "time_s,probe_C\n0,40\n60,41\n30,42\n")
run_ok(backwards 2 fit ${study} --probe-log back.csv ${lib})
must_have(backwards "${err}" "back.csv:4")
# A probe hotter than the medium after the come-up (a swapped thermocouple) is named with its reading.
file(WRITE ${w}/swapped.csv "time_s,probe_C\n0,40\n600,60\n900,130\n1200,90\n1800,100\n2400,110\n")
run_ok(swapped 0 fit ${study} --probe-log swapped.csv ${lib})
must_have(swapped "${out}" "reading 3 is hotter than the medium")
