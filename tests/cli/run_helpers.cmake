# Helpers of the command-line scripts run by CTest (-DEXE the binary; `w` the scratch folder the
# including script sets).

# run_ok(CASE EXPECT_EXIT [INPUT file] ARGS...): runs coldcore in the scratch folder; sets out/err.
function(run_ok case expect)
  cmake_parse_arguments(R "" "INPUT" "" ${ARGN})
  if(R_INPUT)
    execute_process(COMMAND ${EXE} ${R_UNPARSED_ARGUMENTS} WORKING_DIRECTORY ${w} INPUT_FILE ${R_INPUT}
                    RESULT_VARIABLE rc OUTPUT_VARIABLE o ERROR_VARIABLE e)
  else()
    execute_process(COMMAND ${EXE} ${R_UNPARSED_ARGUMENTS} WORKING_DIRECTORY ${w}
                    RESULT_VARIABLE rc OUTPUT_VARIABLE o ERROR_VARIABLE e)
  endif()
  if(NOT rc EQUAL expect)
    message(FATAL_ERROR "${case}: exit ${rc}, expected ${expect}; stderr: ${e}")
  endif()
  set(out "${o}" PARENT_SCOPE)
  set(err "${e}" PARENT_SCOPE)
endfunction()

function(must_have case text what)
  string(FIND "${text}" "${what}" at)
  if(at EQUAL -1)
    message(FATAL_ERROR "${case}: lacks \"${what}\" in: ${text}")
  endif()
endfunction()
