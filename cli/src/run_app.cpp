#include "run_app.hpp"

#include <cstdio>
#include <stdexcept>

#include <fmt/format.h>

#include "input_error.hpp"
#include "wetfront/soils/lab_csv.hpp"

namespace wetfront::cli {

int run_app(CLI::App& app, int argc, char** argv) {
  try {
    app.parse(argc, argv);
  } catch (const CLI::RuntimeError& error) {
    // Thrown by a command that has already reported, to set the exit code (2: solver failure).
    return error.get_exit_code();
  } catch (const CLI::ParseError& error) {
    // --help and --version arrive here with code 0; every other parse error is bad input.
    return app.exit(error) == 0 ? exit_ok : exit_bad_input;
  } catch (const InputError& error) {
    fmt::print(stderr, "error: {}\n", error.what());
    return exit_bad_input;
  } catch (const soils::LabDataError& error) {
    fmt::print(stderr, "error: {}\n", error.what());
    return exit_bad_input;
  } catch (const std::invalid_argument& error) {
    fmt::print(stderr, "error: {}\n", error.what());
    return exit_bad_input;
  } catch (const std::exception& error) {
    // Anything else is a fault of the program or the machine (out of memory, a disk error),
    // not of the input: say so with its own exit code rather than end without a message.
    std::fprintf(stderr, "error: internal failure: %s\n", error.what());
    return exit_internal_failure;
  }
  return exit_ok;
}

}  // namespace wetfront::cli
