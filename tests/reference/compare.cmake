# Regenerates a reference table (SCRIPT, printing REF) with the reference
# libraries and compares it with the committed copy. Missing libraries are a failure, not a skip: the test
# command installs them (.ci/install-deps), and a check that cannot run must
# not pass.
if(NOT SCRIPT OR NOT REF)
  message(FATAL_ERROR "compare.cmake needs SCRIPT and REF")
endif()
execute_process(COMMAND ${PYTHON} -c "import scipy, statsmodels, mpmath, numpy" RESULT_VARIABLE have)
if(NOT have EQUAL 0)
  message(FATAL_ERROR "python3-scipy, python3-statsmodels or python3-mpmath is missing: run .ci/install-deps")
endif()
execute_process(COMMAND ${PYTHON} ${DIR}/${SCRIPT} OUTPUT_FILE ${OUT} RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "${SCRIPT} failed")
endif()
execute_process(COMMAND ${CMAKE_COMMAND} -E compare_files ${OUT} ${DIR}/${REF} RESULT_VARIABLE same)
if(NOT same EQUAL 0)
  message(FATAL_ERROR "tests/reference/${REF} differs from what ${SCRIPT} prints now: regenerate and review")
endif()
