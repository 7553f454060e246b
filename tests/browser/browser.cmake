# The real-browser check: a synthetic report written as HTML, then loaded, printed and
# screenshotted by Debian's chromium (scripts/browser_check.sh). Exit 77 = skipped (chromium
# could not be installed), reported by CTest as "Skipped", never as passed.
add_executable(make_sample_report ${PROJECT_SOURCE_DIR}/tests/browser/make_sample_report.cpp)
target_link_libraries(make_sample_report PRIVATE coldcore::core)
target_include_directories(make_sample_report PRIVATE ${PROJECT_SOURCE_DIR}/tests)
target_compile_options(make_sample_report PRIVATE ${COLDCORE_WARNINGS})

add_test(NAME browser.html_report
         COMMAND bash ${PROJECT_SOURCE_DIR}/scripts/browser_check.sh $<TARGET_FILE:make_sample_report>
                 ${CMAKE_BINARY_DIR}/browser_check
         WORKING_DIRECTORY ${PROJECT_SOURCE_DIR})
set_tests_properties(browser.html_report PROPERTIES SKIP_RETURN_CODE 77 TIMEOUT 300 RUN_SERIAL TRUE)
