# Regenerates omnibus.csv with the reference libraries and compares it with
# the committed copy. Missing libraries are a failure, not a skip: the test
# command installs them (.ci/install-deps), and a check that cannot run must
# not pass.
execute_process(COMMAND ${PYTHON} -c "import scipy, statsmodels, mpmath, numpy" RESULT_VARIABLE have)
if(NOT have EQUAL 0)
  message(FATAL_ERROR "python3-scipy, python3-statsmodels or python3-mpmath is missing: run .ci/install-deps")
endif()
execute_process(COMMAND ${PYTHON} ${DIR}/generate.py OUTPUT_FILE ${OUT} RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "generate.py failed")
endif()
execute_process(COMMAND ${CMAKE_COMMAND} -E compare_files ${OUT} ${DIR}/omnibus.csv RESULT_VARIABLE same)
if(NOT same EQUAL 0)
  message(FATAL_ERROR "tests/reference/omnibus.csv differs from what generate.py prints now: regenerate and review")
endif()
