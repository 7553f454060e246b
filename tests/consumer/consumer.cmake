# install.consumer: installs this build into a scratch prefix, configures and builds
# tests/consumer against it with find_package(coldcore), runs the program, then runs the
# installed executable from another folder with no data path given, to show that it finds its
# data libraries relative to itself (share/coldcore). Run by ctest; -DBUILD_DIR, -DSOURCE_DIR.
set(prefix ${BUILD_DIR}/install-check/prefix)
set(consumer_build ${BUILD_DIR}/install-check/consumer)
file(REMOVE_RECURSE ${BUILD_DIR}/install-check)
function(step)
  execute_process(COMMAND ${ARGN} RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err)
  if(NOT rc EQUAL 0)
    message(FATAL_ERROR "failed (${rc}): ${ARGN}\n${out}\n${err}")
  endif()
  set(step_out "${out}" PARENT_SCOPE)
endfunction()
step(${CMAKE_COMMAND} --install ${BUILD_DIR} --prefix ${prefix})
foreach(f bin/coldcore include/coldcore/version.hpp include/coldcore/conduction/modes.hpp
          share/coldcore/organisms.toml share/coldcore/cooling-rules.toml share/coldcore/media.toml
          share/coldcore/cooking-tables.toml)
  if(NOT EXISTS ${prefix}/${f})
    message(FATAL_ERROR "not installed: ${f}")
  endif()
endforeach()
step(${CMAKE_COMMAND} -S ${SOURCE_DIR}/tests/consumer -B ${consumer_build} -DCMAKE_PREFIX_PATH=${prefix}
     -DCMAKE_BUILD_TYPE=Release)
step(${CMAKE_COMMAND} --build ${consumer_build})
step(${consumer_build}/consumer)
message(STATUS "${step_out}")
# The installed executable, run from the scratch folder: its provenance names the data it read.
set(ENV{COLDCORE_DATA_DIR} "")
execute_process(COMMAND ${prefix}/bin/coldcore rules --format json WORKING_DIRECTORY ${BUILD_DIR}/install-check
                RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "installed coldcore rules failed (${rc}): ${err}")
endif()
string(FIND "${out}" "share/coldcore/cooling-rules.toml" at)
if(at EQUAL -1)
  message(FATAL_ERROR "installed coldcore did not read share/coldcore/cooling-rules.toml:\n${out}")
endif()
