# issue 13 item 3 / issue 18 item 5: --conservative spreads its cases over threads, and the result
# does not depend on how many: every byte is the same with 1 and 3 threads (the cheapest
# conservative case, as the sanitizer build runs this too; tests/process/parallel_test.cpp checks
# the scheduler itself on more counts).
# Run by ctest with -DEXE, -DSRC (source tree), -DWORK (scratch folder).
# One case per entry, its arguments separated by | (a CMake list cannot nest).
set(cases
    "deviation|products/kofta-balls.toml|--medium-log|products/logs/kofta-oven-deviation.csv|--conservative")
foreach(shown IN LISTS cases)
  string(REPLACE "|" ";" argv "${shown}")
  set(first "")
  foreach(n 1 3)
    execute_process(COMMAND ${EXE} ${argv} --threads ${n} --format json --date 2026-12-01
                    WORKING_DIRECTORY ${SRC} RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err)
    if(rc GREATER 1)
      message(FATAL_ERROR "${shown} --threads ${n}: exit ${rc}: ${err}")
    endif()
    if(first STREQUAL "")
      set(first "${out}")
      string(FIND "${out}" "\"driven_by\"" at)
      if(at EQUAL -1)
        message(FATAL_ERROR "${shown}: no conservative result in the output")
      endif()
    elseif(NOT out STREQUAL first)
      message(FATAL_ERROR "${shown}: --threads ${n} gave other bytes than --threads 1")
    endif()
  endforeach()
endforeach()
