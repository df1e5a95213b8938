# Fails when extension/FUNCTIONS.md is not what catalog_dump prints now.
# To update: build, then run  build/extension/catalog_dump > extension/FUNCTIONS.md
execute_process(COMMAND ${DUMP} OUTPUT_FILE ${OUT} RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "catalog_dump failed")
endif()
execute_process(COMMAND ${CMAKE_COMMAND} -E compare_files ${OUT} ${REF} RESULT_VARIABLE same)
if(NOT same EQUAL 0)
  message(FATAL_ERROR "extension/FUNCTIONS.md is out of date: run catalog_dump > extension/FUNCTIONS.md")
endif()
