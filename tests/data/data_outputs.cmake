# The data outputs read by other programs (issue 16): every verb's json against the schema in
# schemas/, and every verb's csv by pandas and LibreOffice Calc. Both install their Debian
# package when missing and report "skipped" (exit 77) only where it cannot be installed. Plain
# build only: they check formats, which the sanitizer build writes the same way.
if(NOT COLDCORE_SANITIZE)
  add_test(NAME data.json_schema
           COMMAND bash ${PROJECT_SOURCE_DIR}/tests/data/check_json_schema.sh $<TARGET_FILE:coldcore>
                   ${CMAKE_BINARY_DIR}/data_json_schema)
  add_test(NAME data.csv_readers
           COMMAND bash ${PROJECT_SOURCE_DIR}/tests/data/check_csv_readers.sh $<TARGET_FILE:coldcore>
                   ${CMAKE_BINARY_DIR}/data_csv_readers)
  set_tests_properties(data.json_schema data.csv_readers PROPERTIES SKIP_RETURN_CODE 77 TIMEOUT 600 RUN_SERIAL TRUE)
endif()
