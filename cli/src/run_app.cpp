#include "run_app.hpp"

#include <cstdio>
#include <exception>

#include <fmt/format.h>

#include "exit_codes.hpp"
#include "wetfront/base/input_error.hpp"

namespace wetfront::cli {
namespace {

// A fault of the program (a broken precondition, an unexpected exception) or of the machine
// (out of memory, a disk error): never the user's mistake, and said so.
int report_internal_fault(const char* what) {
  std::fprintf(stderr,
               "error: internal fault of wetfront: %s\n"
               "This is a fault of the program, not of your input. Please report it with the command line, the "
               "output of `wetfront --version` and the input files.\n",
               what);
  return exit_internal_failure;
}

}  // namespace

int run_app(CLI::App& app, int argc, char** argv) {
  try {
    app.parse(argc, argv);
  } catch (const CLI::RuntimeError& error) {
    // Thrown by a command that has already reported, to set the exit code (2: solver failure).
    return error.get_exit_code();
  } catch (const CLI::ParseError& error) {
    // --help and --version arrive here with code 0; every other parse error is bad input.
    return app.exit(error) == 0 ? exit_ok : exit_bad_input;
  } catch (const base::InputError& error) {
    fmt::print(stderr, "error: {}\n", error.what());
    return exit_bad_input;
  } catch (const std::exception& error) {
    return report_internal_fault(error.what());
  } catch (...) {
    return report_internal_fault("an exception of unknown type");
  }
  return exit_ok;
}

}  // namespace wetfront::cli
