// terzo: the command-line front end. Parses arguments, calls core, prints.
#include <iostream>

#include "cli/commands.hpp"
#include "core/error.hpp"
#include "core/text.hpp"

int main(int argc, char** argv) {
    CLI::App app{"terzo: a workbench for tunings and temperaments, built around the combination\n"
                 "tones (resultants) of every dyad and chord. Give a subcommand; each has --help."};
    app.set_version_flag("--version", std::string("terzo ") + TERZO_VERSION);
    app.require_subcommand(1);
    terzo::cli::add_inspect(app);
    terzo::cli::add_resultants(app);
    terzo::cli::add_sheet(app);
    terzo::cli::add_compare(app);
    terzo::cli::add_search(app);
    terzo::cli::add_rank(app);
    terzo::cli::add_render(app);
    terzo::cli::add_export(app);
    terzo::cli::add_measure(app);
    terzo::cli::add_suggest(app);
    try {
        app.parse(argc, argv);
    } catch (const terzo::cli::ExitStatus& e) {
        return e.code;
    } catch (const CLI::ParseError& e) {
        if (e.get_exit_code() == 0) return app.exit(e); // --help, --version
        // One line in the same form as every other terzo error; exit status 2 for usage.
        std::cerr << "terzo: error: " << terzo::printable(e.what()) << " (see terzo --help)\n";
        return 2;
    } catch (const terzo::InputError& e) {
        std::cerr << terzo::printable(e.what()) << '\n';
        return 1;
    } catch (const std::exception& e) {
        std::cerr << "terzo: error: " << terzo::printable(e.what()) << '\n';
        return 1;
    }
    return 0;
}
