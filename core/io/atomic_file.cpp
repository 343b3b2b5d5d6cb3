#include "core/io/atomic_file.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <sstream>
#include <string>

#include <fcntl.h>
#include <signal.h>
#include <sys/stat.h>
#include <unistd.h>

#include "core/error.hpp"

namespace terzo {

namespace {

// The system's reason, with what it means for a user where the words alone are unclear.
std::string errno_text() {
    const int e = errno;
    std::string text = std::strerror(e);
    if (e == ENOSPC || e == EDQUOT || e == EFBIG)
        return "the disk is full or a file size limit was reached (" + text + ")";
    return text;
}

// Writes all of data to fd, retrying short writes.
bool write_all(int fd, const std::string& data) {
    std::size_t done = 0;
    while (done < data.size()) {
        ssize_t n = ::write(fd, data.data() + done, data.size() - done);
        if (n < 0) {
            if (errno == EINTR) continue;
            return false;
        }
        done += static_cast<std::size_t>(n);
    }
    return true;
}

// Temporary names: short, so that a target of 255 bytes still works, and carrying the
// process id, so that a later run can tell a leftover of a killed process from the temporary
// of one still writing.
constexpr const char* temporary_prefix = ".tz-";

std::string temporary_template(const std::filesystem::path& dir) {
    return (dir / (temporary_prefix + std::to_string(::getpid()) + "-XXXXXX")).string();
}

// The file a write to path replaces: path itself, or the end of its chain of symbolic links.
std::filesystem::path write_target(std::filesystem::path path) {
    namespace fs = std::filesystem;
    for (int hops = 0; hops < 40; ++hops) {
        std::error_code ec;
        if (!fs::is_symlink(fs::symlink_status(path, ec))) break;
        fs::path to = fs::read_symlink(path, ec);
        if (ec) break;
        path = to.is_absolute() ? to : path.parent_path() / to;
    }
    return path;
}

// Creates path with data, flushed to disk; on failure removes it and throws InputError at pos.
void write_new_file(const std::string& path, const std::string& data, const SourcePos& pos,
                    const std::string& unchanged) {
    int fd = ::open(path.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, 0644);
    if (fd < 0) fail(pos, "cannot create a file in the temporary folder: " + errno_text() + unchanged);
    if (!write_all(fd, data) || ::fsync(fd) != 0) {
        std::string reason = errno_text();
        ::close(fd);
        ::unlink(path.c_str());
        fail(pos, "cannot write: " + reason + unchanged);
    }
    if (::close(fd) != 0) {
        std::string reason = errno_text();
        ::unlink(path.c_str());
        fail(pos, "cannot close: " + reason + unchanged);
    }
}

void sync_folder(const std::filesystem::path& dir) {
    int dfd = ::open(dir.c_str(), O_RDONLY | O_DIRECTORY);
    if (dfd >= 0) {
        ::fsync(dfd);
        ::close(dfd);
    }
}

} // namespace

void remove_stale_temporaries(const std::filesystem::path& folder) {
    namespace fs = std::filesystem;
    std::error_code ec;
    fs::directory_iterator it(folder.empty() ? fs::path(".") : folder, ec), end;
    for (; !ec && it != end; it.increment(ec)) {
        const std::string name = it->path().filename().string();
        if (name.rfind(temporary_prefix, 0) != 0) continue;
        std::size_t i = std::strlen(temporary_prefix);
        long long pid = 0;
        for (; i < name.size() && name[i] >= '0' && name[i] <= '9' && pid < 100000000; ++i)
            pid = pid * 10 + (name[i] - '0');
        if (i >= name.size() || name[i] != '-' || pid <= 0 || pid == ::getpid()) continue;
        if (::kill(static_cast<pid_t>(pid), 0) == 0 || errno != ESRCH) continue; // still running
        std::error_code e2;
        fs::remove_all(it->path(), e2);
    }
}

void check_target(const std::filesystem::path& path, Overwrite overwrite) {
    namespace fs = std::filesystem;
    const SourcePos pos{path.string(), 0, 0};
    std::error_code ec;
    const fs::file_status st = fs::status(path, ec);
    if (fs::is_directory(st)) fail(pos, "is a folder; give a file name");
    // Renaming over a device or a pipe would replace it with a plain file.
    if (fs::exists(st) && !fs::is_regular_file(st))
        fail(pos, "is not a regular file (a device, pipe or socket); give a file name");
    // A dangling symbolic link exists as a name: refused like any existing file.
    if (overwrite == Overwrite::refuse && fs::exists(fs::symlink_status(path, ec)))
        fail(pos, "already exists and was not changed (allow overwriting to replace it)");
    // The folder is checked by its absolute name but named as the user wrote it; through a
    // symbolic link, it is the folder of the file the link points to.
    const fs::path target = write_target(path);
    const fs::file_status dir_st =
        fs::status(fs::absolute(target, ec).lexically_normal().parent_path(), ec);
    const std::string dir = target.has_parent_path() ? target.parent_path().string() : ".";
    if (!fs::exists(dir_st)) fail(pos, "folder " + dir + " does not exist");
    if (!fs::is_directory(dir_st)) fail(pos, dir + " is a file, not a folder");
}

void write_file_atomically(const std::filesystem::path& path,
                           const std::function<void(std::ostream&)>& write, Overwrite overwrite) {
    check_target(path, overwrite);
    std::ostringstream buffer;
    write(buffer); // may throw; nothing is on disk yet
    write_files_together({{path, buffer.str()}}, overwrite);
}

void write_files_together(const std::vector<FileAt>& files, Overwrite overwrite) {
    namespace fs = std::filesystem;
    for (const FileAt& f : files) check_target(f.path, overwrite);
    struct Staged {
        fs::path target;  // the file replaced: the end of a chain of links
        std::string temp; // its temporary, beside it; empty once moved or removed
    };
    std::vector<Staged> staged;
    auto remove_temporaries = [&] {
        for (Staged& s : staged)
            if (!s.temp.empty()) ::unlink(s.temp.c_str());
    };
    // What a failure leaves: one file says whether it existed; a set says none was touched.
    auto unchanged_text = [&](const fs::path& target) -> std::string {
        if (files.size() > 1) return "; none of the " + std::to_string(files.size()) + " files was written";
        std::error_code ec;
        return fs::exists(target, ec) ? "; the existing file was not changed" : "; no file was created";
    };
    // Phase 1: every file complete and flushed beside its target, under a temporary name.
    for (const FileAt& f : files) {
        const SourcePos pos{f.path.string(), 0, 0};
        Staged s{write_target(f.path), {}};
        fs::path dir = s.target.parent_path();
        if (dir.empty()) dir = ".";
        remove_stale_temporaries(dir);
        std::string tmpl = temporary_template(dir);
        const int fd = ::mkstemp(tmpl.data());
        if (fd < 0) {
            const std::string reason = errno_text();
            remove_temporaries();
            fail(pos, "cannot create a file in " + dir.string() + ": " + reason +
                          (files.size() > 1 ? unchanged_text(s.target) : ""));
        }
        s.temp = tmpl;
        staged.push_back(s);
        auto give_up = [&](const std::string& what) {
            const std::string reason = errno_text();
            ::close(fd);
            remove_temporaries();
            fail(pos, what + ": " + reason + unchanged_text(s.target));
        };
        if (!write_all(fd, f.data)) give_up("cannot write");
        if (::fsync(fd) != 0) give_up("cannot flush to disk");
        // mkstemp makes the file 0600; give it the usual permissions for a user's document.
        ::fchmod(fd, 0644);
        if (::close(fd) != 0) {
            const std::string reason = errno_text();
            remove_temporaries();
            fail(pos, "cannot close: " + reason + unchanged_text(s.target));
        }
    }
    // Phase 2: renames, which need no space; only a change on disk since the checks can make
    // one fail.
    for (std::size_t i = 0; i < staged.size(); ++i) {
        Staged& s = staged[i];
        const SourcePos pos{files[i].path.string(), 0, 0};
        const bool refuse = overwrite == Overwrite::refuse;
        // link() fails if the target appeared meanwhile, so a concurrent file is never lost.
        const bool ok = refuse ? ::link(s.temp.c_str(), s.target.c_str()) == 0
                               : std::rename(s.temp.c_str(), s.target.c_str()) == 0;
        if (!ok) {
            const std::string reason = errno_text();
            remove_temporaries();
            std::string note = i == 0 ? (refuse && files.size() == 1 ? "" : unchanged_text(s.target))
                                      : "; already in place: " + std::to_string(i) + " of " +
                                            std::to_string(files.size()) + " files, the first " +
                                            files.front().path.string();
            fail(pos, std::string(refuse ? "cannot create: " : "cannot replace: ") + reason + note);
        }
        if (refuse) ::unlink(s.temp.c_str());
        s.temp.clear();
        fs::path dir = s.target.parent_path();
        sync_folder(dir.empty() ? fs::path(".") : dir); // make the rename itself durable
    }
}

std::vector<std::filesystem::path> write_file_set(const std::filesystem::path& folder,
                                                  const std::vector<FileContent>& files,
                                                  Overwrite overwrite, const std::string& option) {
    namespace fs = std::filesystem;
    const SourcePos at{option, 0, 0};
    std::error_code ec;
    const fs::file_status st = fs::status(folder, ec);
    if (fs::exists(st) && !fs::is_directory(st))
        fail(at, folder.string() + " is a file, not a folder (no file was written)");
    const bool existed = fs::exists(st);
    std::vector<fs::path> paths;
    for (const FileContent& f : files) paths.push_back(folder / f.name);
    if (existed)
        for (const fs::path& p : paths) check_target(p, overwrite);
    // The staging folder sits where the files will end up, so the final moves are renames
    // within one file system and need no space.
    fs::path base = existed ? folder : fs::absolute(folder, ec).lexically_normal().parent_path();
    if (!existed) {
        fs::create_directories(base, ec);
        if (ec) fail(at, "cannot create the folder " + base.string() + ": " + ec.message() + " (no file was written)");
    }
    remove_stale_temporaries(base);
    std::string stage = temporary_template(base);
    if (::mkdtemp(stage.data()) == nullptr)
        fail(at, "cannot create a temporary folder in " + base.string() + ": " + errno_text() +
                     " (no file was written)");
    auto give_up = [&](const SourcePos& pos, const std::string& message) {
        std::error_code e2;
        fs::remove_all(stage, e2);
        fail(pos, message);
    };
    const std::string unchanged = existed ? "; no file in the folder was created or changed" : "; no file was created";
    for (std::size_t i = 0; i < files.size(); ++i) {
        try {
            write_new_file((fs::path(stage) / files[i].name).string(), files[i].data, {paths[i].string(), 0, 0}, unchanged);
        } catch (const InputError& e) {
            give_up(e.pos(), e.message());
        }
    }
    sync_folder(stage);
    if (!existed && ::rename(stage.c_str(), folder.c_str()) == 0) {
        ::chmod(folder.c_str(), 0755); // mkdtemp makes it 0700; a new folder gets the usual permissions
        sync_folder(base);
        return paths;
    }
    // Into an existing folder (or one that appeared meanwhile): file by file. Only a change
    // on disk since the checks above can make one of these fail.
    std::vector<std::string> moved;
    for (std::size_t i = 0; i < files.size(); ++i) {
        const std::string from = (fs::path(stage) / files[i].name).string();
        const fs::path to = write_target(paths[i]);
        const bool ok = overwrite == Overwrite::refuse ? ::link(from.c_str(), to.c_str()) == 0
                                                       : ::rename(from.c_str(), to.c_str()) == 0;
        if (!ok) {
            std::string reason = errno_text();
            give_up({paths[i].string(), 0, 0},
                    "cannot move into place: " + reason +
                        (moved.empty() ? unchanged : "; already in place: " + std::to_string(moved.size()) + " of " +
                                                         std::to_string(files.size()) + " files, the first " + moved.front()));
        }
        moved.push_back(paths[i].string());
    }
    std::error_code e2;
    fs::remove_all(stage, e2);
    sync_folder(folder);
    return paths;
}

} // namespace terzo
