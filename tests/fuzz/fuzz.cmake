# libFuzzer harnesses (COLDCORE_FUZZ=ON, clang only). Each tests/fuzz/<name>_fuzz.cpp becomes the
# executable fuzz_<name>; scripts/fuzz.sh runs them. The whole build (library, tests, harnesses)
# is instrumented for coverage (-fsanitize=fuzzer-no-link, set in CMakeLists.txt), so the
# sanitizer build and the fuzz build are one build.
file(GLOB COLDCORE_FUZZ_SOURCES CONFIGURE_DEPENDS ${PROJECT_SOURCE_DIR}/tests/fuzz/*_fuzz.cpp)
# The command-line harness needs the verbs without main().
file(GLOB COLDCORE_FUZZ_CLI_SOURCES CONFIGURE_DEPENDS ${PROJECT_SOURCE_DIR}/src/cli/*.cpp)
list(FILTER COLDCORE_FUZZ_CLI_SOURCES EXCLUDE REGEX "/main\\.cpp$")
add_library(coldcore_cli_verbs OBJECT ${COLDCORE_FUZZ_CLI_SOURCES})
target_link_libraries(coldcore_cli_verbs PUBLIC coldcore::core CLI11::CLI11)
target_include_directories(coldcore_cli_verbs PUBLIC ${PROJECT_SOURCE_DIR}/src)
target_compile_options(coldcore_cli_verbs PRIVATE ${COLDCORE_WARNINGS})
target_compile_definitions(coldcore_cli_verbs PRIVATE COLDCORE_SOURCE_DIR="${PROJECT_SOURCE_DIR}"
  COLDCORE_DATA_SUBDIR="${CMAKE_INSTALL_DATADIR}/coldcore")
foreach(src ${COLDCORE_FUZZ_SOURCES})
  get_filename_component(name ${src} NAME_WE)
  string(REGEX REPLACE "_fuzz$" "" name ${name})
  add_executable(fuzz_${name} ${src})
  target_link_libraries(fuzz_${name} PRIVATE coldcore::core)
  if(name STREQUAL "cli")
    target_link_libraries(fuzz_${name} PRIVATE coldcore_cli_verbs)
  endif()
  target_include_directories(fuzz_${name} PRIVATE ${PROJECT_SOURCE_DIR}/tests ${PROJECT_SOURCE_DIR}/src)
  target_compile_options(fuzz_${name} PRIVATE ${COLDCORE_WARNINGS})
  target_compile_definitions(fuzz_${name} PRIVATE COLDCORE_SOURCE_DIR="${PROJECT_SOURCE_DIR}")
  target_link_options(fuzz_${name} PRIVATE -fsanitize=fuzzer)
endforeach()
