// Internal to io: the steps a file and a folder publication share. Not part of the io API.
#pragma once
#include <string>

namespace ellipsa::io::detail {

// A new name beside `path` that nothing uses: path + ".tmp-" + 8 random letters or digits.
// The caller creates it exclusively (O_EXCL, mkdir) and asks again when it exists after all.
std::string temporary_name(const std::string& path);

// Move `from` to `to` only when nothing is at `to` (a file, folder, link, dangling link), decided
// in the same step as the move: renameat2(RENAME_NOREPLACE), else link(2) and unlink for a file
// (a folder: rename, which fails on anything but an empty folder). Returns 0 or an errno
// (EEXIST: something is there).
int rename_no_replace(const std::string& from, const std::string& to, bool folder);

// Flush the folder that holds `path`, so a rename survives a crash.
void sync_parent(const std::string& path);

// Why nothing can be created beside `path` (open(2) or mkdir(2) of the temporary failed with
// errno `e`): names the folder and the reason ("the folder out does not exist", ...).
std::string parent_problem(const std::string& path, int e);

// Why an existing `st` (from lstat) at the target can never be replaced by a file or folder
// write, whatever --force says: "" when it can. A device, FIFO or socket is never written
// (writing through one is not atomic, and replacing its node would remove it).
std::string unreplaceable_kind(unsigned st_mode);

// "already exists; use --force to replace it": the one message of a refusal to replace.
inline constexpr const char* exists_message = "already exists; use --force to replace it";

}  // namespace ellipsa::io::detail
