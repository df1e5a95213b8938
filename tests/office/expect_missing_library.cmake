# Proof that the integration suite notices a package without the component
# library: running test_calc_files.py against such a package must fail, and
# fail because our functions are unknown to Calc (Err:525, #NAME?), not for
# some other reason (soffice not starting, say).
execute_process(COMMAND ${CMAKE_COMMAND} -E env TALLYRATES_OXT=${BROKEN_OXT} ${PYTHON} ${SUITE}
                RESULT_VARIABLE rc OUTPUT_VARIABLE out ERROR_VARIABLE err)
if(rc EQUAL 0)
  message(FATAL_ERROR "the suite passed with a package lacking tallyrates.so:\n${out}${err}")
endif()
string(FIND "${out}${err}" "shows Err:525" where)
if(where EQUAL -1)
  message(FATAL_ERROR "the suite failed, but not because the functions were missing:\n${out}${err}")
endif()
message(STATUS "as required, the suite failed on the broken package with Err:525 (#NAME?)")
