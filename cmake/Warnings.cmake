# wetfront_warnings: the warning set every target in the project compiles with.
add_library(wetfront_warnings INTERFACE)
target_compile_options(wetfront_warnings INTERFACE -Wall -Wextra -Wpedantic -Wshadow)
if(WETFRONT_SANITIZE)
  target_compile_options(wetfront_warnings INTERFACE -fsanitize=address,undefined -fno-omit-frame-pointer -fno-sanitize-recover=undefined)
  target_link_options(wetfront_warnings INTERFACE -fsanitize=address,undefined)
endif()
