# Regenerates omnibus.csv with the reference libraries and compares it with
# the committed copy. Skipped (exit code 77 would need ctest SKIP support; we
# simply report) when the libraries are missing.
execute_process(COMMAND ${PYTHON} -c "import scipy, statsmodels, mpmath" RESULT_VARIABLE have)
if(NOT have EQUAL 0)
  message(STATUS "reference libraries not installed: nothing to compare")
  return()
endif()
execute_process(COMMAND ${PYTHON} ${DIR}/generate.py OUTPUT_FILE ${OUT} RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "generate.py failed")
endif()
execute_process(COMMAND ${CMAKE_COMMAND} -E compare_files ${OUT} ${DIR}/omnibus.csv RESULT_VARIABLE same)
if(NOT same EQUAL 0)
  message(FATAL_ERROR "tests/reference/omnibus.csv differs from what generate.py prints now: regenerate and review")
endif()
