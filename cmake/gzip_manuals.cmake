# cmake -DDIR=folder -P gzip_manuals.cmake: compresses every manual page (*.1) in DIR with
# gzip -9n, as Debian policy (12.3) asks; -n stores no name or time, so the package is reproducible.
file(GLOB pages "${DIR}/*.1")
foreach(page IN LISTS pages)
  execute_process(COMMAND gzip -9nf "${page}" RESULT_VARIABLE rc)
  if(rc)
    message(FATAL_ERROR "gzip ${page} failed (${rc})")
  endif()
endforeach()
