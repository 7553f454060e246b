# issue 18: --out never destroys an input and never leaves part of a report behind.
# Run by ctest with -DEXE (the coldcore executable), -DSRC (source tree), -DWORK (scratch folder).
# Each case runs coldcore as a user would, then checks the exit code, the message, that every
# input still has its SHA-256 and that the scratch folder holds exactly the files expected.
set(w ${WORK}/out-safety)
file(REMOVE_RECURSE ${w})
file(MAKE_DIRECTORY ${w}/logs ${w}/adir)
file(COPY ${SRC}/products/kofta-balls.toml ${SRC}/products/organisms.toml ${SRC}/products/cooling-rules.toml
          ${SRC}/products/cooking-tables.toml DESTINATION ${w})
file(COPY ${SRC}/products/logs/kofta-probe.csv DESTINATION ${w}/logs)

function(expect_refused case expect_err)
  file(SHA256 ${w}/kofta-balls.toml p0)
  file(SHA256 ${w}/logs/kofta-probe.csv l0)
  file(GLOB_RECURSE before RELATIVE ${w} ${w}/*)
  execute_process(COMMAND ${EXE} ${ARGN} WORKING_DIRECTORY ${w} RESULT_VARIABLE rc ERROR_VARIABLE err OUTPUT_QUIET)
  if(NOT rc EQUAL 2)
    message(FATAL_ERROR "${case}: exit ${rc}, expected 2; stderr: ${err}")
  endif()
  string(FIND "${err}" "${expect_err}" at)
  if(at EQUAL -1)
    message(FATAL_ERROR "${case}: stderr lacks \"${expect_err}\": ${err}")
  endif()
  file(SHA256 ${w}/kofta-balls.toml p1)
  file(SHA256 ${w}/logs/kofta-probe.csv l1)
  if(NOT p0 STREQUAL p1 OR NOT l0 STREQUAL l1)
    message(FATAL_ERROR "${case}: an input file was changed")
  endif()
  file(GLOB_RECURSE after RELATIVE ${w} ${w}/*)
  if(NOT before STREQUAL after)
    message(FATAL_ERROR "${case}: files before [${before}] and after [${after}]")
  endif()
endfunction()

expect_refused(product_as_out "--out = kofta-balls.toml: is the input file kofta-balls.toml; choose another name"
               run kofta-balls.toml --out kofta-balls.toml)
expect_refused(product_as_out_other_spelling "is the input file kofta-balls.toml"
               run kofta-balls.toml --out ./logs/../kofta-balls.toml)
expect_refused(log_as_out "--out = logs/kofta-probe.csv: is the input file logs/kofta-probe.csv"
               probe logs/kofta-probe.csv --organism listeria-monocytogenes --out logs/kofta-probe.csv)
expect_refused(library_as_out "--out = organisms.toml: is the input file organisms.toml"
               run kofta-balls.toml --out organisms.toml)
expect_refused(directory_as_out "--out = adir: is a directory; give a file name"
               run kofta-balls.toml --format md --out adir)
expect_refused(device_as_out "--out = /dev/null: exists and is not a regular file"
               run kofta-balls.toml --out /dev/null)
expect_refused(missing_folder "--out = nowhere/r.md: side file nowhere/"
               run kofta-balls.toml --format md --out nowhere/r.md)

# A good run writes the report and its plots, and no temporary is left.
execute_process(COMMAND ${EXE} run kofta-balls.toml --format md --out r.md --date 2026-12-01
                WORKING_DIRECTORY ${w} RESULT_VARIABLE rc ERROR_VARIABLE err OUTPUT_QUIET)
if(rc GREATER 1)
  message(FATAL_ERROR "good run: exit ${rc}: ${err}")
endif()
file(GLOB left RELATIVE ${w} ${w}/*.tmp-coldcore)
file(GLOB svgs RELATIVE ${w} ${w}/r-*.svg)
if(NOT EXISTS ${w}/r.md OR svgs STREQUAL "" OR NOT left STREQUAL "")
  message(FATAL_ERROR "good run: r.md, plots [${svgs}], temporaries left [${left}]")
endif()
file(REMOVE_RECURSE ${w})
