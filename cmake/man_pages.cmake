# Writes a man page for each subcommand of terzo from its --help, with help2man:
#   cmake -DTERZO=path/to/terzo -DHELP2MAN=path -DOUT=folder -DVERSION=x.y.z -P man_pages.cmake
# The subcommands are read from `terzo --help`, so a new one gets its page without a list to
# keep. help2man runs a program with --help; each page runs a small script that calls
# `terzo SUBCOMMAND`. Also writes OUT/see-also.h2m, the [SEE ALSO] section of terzo.1.
execute_process(COMMAND ${TERZO} --help OUTPUT_VARIABLE help RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "${TERZO} --help failed")
endif()
string(REPLACE "\n" ";" lines "${help}")
set(in_list FALSE)
set(subs)
foreach(line IN LISTS lines)
  if(line MATCHES "^Subcommands:")
    set(in_list TRUE)
  elseif(in_list AND line MATCHES "^  ([a-z][a-z0-9-]*)  +(.*)$")
    list(APPEND subs ${CMAKE_MATCH_1})
    set(desc_${CMAKE_MATCH_1} "${CMAKE_MATCH_2}")
  endif()
endforeach()
if(NOT subs)
  message(FATAL_ERROR "no subcommands found in ${TERZO} --help")
endif()
file(MAKE_DIRECTORY ${OUT}/wrappers)
set(see_also "[SEE ALSO]\n")
foreach(sub IN LISTS subs)
  set(wrapper ${OUT}/wrappers/terzo-${sub})
  file(WRITE ${wrapper} "#!/bin/sh\nexec \"${TERZO}\" ${sub} \"$@\"\n")
  file(CHMOD ${wrapper} PERMISSIONS OWNER_READ OWNER_WRITE OWNER_EXECUTE GROUP_READ GROUP_EXECUTE WORLD_READ WORLD_EXECUTE)
  # The page's one-line name: the help's description up to its first full stop.
  string(REGEX REPLACE "\\. .*$" "" name "${desc_${sub}}")
  execute_process(COMMAND ${HELP2MAN} --no-info --no-discard-stderr --section=1 "--name=${name}"
                          "--version-string=${VERSION}" --output=${OUT}/terzo-${sub}.1 ${wrapper}
                  RESULT_VARIABLE rc)
  if(NOT rc EQUAL 0)
    message(FATAL_ERROR "help2man failed for terzo ${sub}")
  endif()
  string(APPEND see_also ".BR terzo-${sub} (1)\n")
endforeach()
file(WRITE ${OUT}/see-also.h2m "${see_also}")
