# check_imports.cmake - the component touches no file, network, process or
# environment: every symbol the loaded library imports (nm -D
# --undefined-only) is checked against the calls that would. A match fails
# the test and names the symbol. Run by ctest as
#   cmake -DLIBRARY=<tallyrates.so> -DNM=<nm> -P check_imports.cmake
cmake_minimum_required(VERSION 3.25)
execute_process(COMMAND ${NM} -D --undefined-only ${LIBRARY} OUTPUT_VARIABLE listing RESULT_VARIABLE failed)
if(failed)
  message(FATAL_ERROR "nm could not read ${LIBRARY}")
endif()
string(REPLACE "\n" ";" lines "${listing}")
set(imports "")
foreach(line IN LISTS lines)
  string(STRIP "${line}" line)
  if(line MATCHES "^[A-Za-z] +([^ @]+)")
    list(APPEND imports "${CMAKE_MATCH_1}")
  endif()
endforeach()
list(LENGTH imports count)
if(count LESS 50)
  message(FATAL_ERROR "only ${count} imports read from ${LIBRARY}: the listing is not what this check expects")
endif()
# C library: files, directories, sockets and names, processes, the environment,
# loading code.
set(denied_c
  open open64 openat openat64 creat creat64 fopen fopen64 freopen fdopen tmpfile mkstemp
  unlink remove rename mkdir rmdir opendir readdir stat stat64 lstat fstat access chdir truncate
  socket connect bind listen accept accept4 send sendto sendmsg recv recvfrom recvmsg
  getaddrinfo gethostbyname gethostbyname2 getnameinfo
  system popen fork vfork execl execlp execle execv execvp execve posix_spawn posix_spawnp
  getenv secure_getenv setenv unsetenv putenv clearenv
  dlopen dlsym)
foreach(name IN LISTS denied_c)
  if("${name}" IN_LIST imports)
    message(FATAL_ERROR "the component imports ${name}")
  endif()
endforeach()
foreach(name IN LISTS imports)
  # LibreOffice's own layer for files, sockets, processes, the environment,
  # modules and bootstrap settings; C++ file streams (mangled names).
  if(name MATCHES "^osl_(.*File|.*Directory|.*Socket|.*Pipe|.*Process|.*Environment|.*Module|.*Profile|.*Security|getEnv|setEnv|clearEnv)"
     OR name MATCHES "^rtl_bootstrap"
     OR name MATCHES "basic_filebuf|basic_ifstream|basic_ofstream|basic_fstream")
    message(FATAL_ERROR "the component imports ${name}")
  endif()
endforeach()
message(STATUS "${count} imports, none of them file, network, process or environment access")
