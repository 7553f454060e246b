# issue 13 item 6: a verb that takes a while says it is working, on stderr, only on a terminal.
# The terminal comes from script(1) (util-linux, -DSCRIPT); the case is only added where it exists.
# COLDCORE_PROGRESS_AFTER_S=0 shows the line at once, so the check does not depend on speed.
set(cmd "${EXE} run products/kofta-balls.toml --date 2026-12-01 -o ${WORK}/progress-report.txt")
execute_process(COMMAND ${CMAKE_COMMAND} -E env COLDCORE_PROGRESS_AFTER_S=0 ${SCRIPT} -qec "${cmd}" /dev/null
                WORKING_DIRECTORY ${SRC} RESULT_VARIABLE rc OUTPUT_VARIABLE tty)
string(FIND "${tty}" "coldcore run: working, 0 s elapsed" at)
if(at EQUAL -1)
  message(FATAL_ERROR "on a terminal: no progress line in: ${tty}")
endif()
string(FIND "${tty}" "report written to" done)
if(done LESS at)
  message(FATAL_ERROR "the progress line must come (and be erased) before the summary line: ${tty}")
endif()
# Not a terminal: nothing but the summary line.
execute_process(COMMAND ${CMAKE_COMMAND} -E env COLDCORE_PROGRESS_AFTER_S=0 ${EXE} run products/kofta-balls.toml
                        --date 2026-12-01 -o ${WORK}/progress-report.txt
                WORKING_DIRECTORY ${SRC} RESULT_VARIABLE rc ERROR_VARIABLE err)
string(FIND "${err}" "working" at)
if(NOT at EQUAL -1)
  message(FATAL_ERROR "stderr is not a terminal but got a progress line: ${err}")
endif()
file(REMOVE ${WORK}/progress-report.txt)
