/** Why a file or stream could not be written, for the errors that lie with the disk, folder or reader, not with averta. */
export const WRITE_PROBLEMS: Readonly<Record<string, string>> = {
  EACCES: "permission denied",
  EPERM: "permission denied",
  EROFS: "the folder is on a read-only disk",
  ENOSPC: "no space left on device (disk full)",
  EDQUOT: "the disk quota is used up",
  EFBIG: "the file would be larger than the disk allows",
  EIO: "the disk reported an input/output error",
  ENAMETOOLONG: "the name is too long for the file system",
  ENOTDIR: "a part of the path is not a folder",
  EISDIR: "it is a folder",
  ENOENT: "the folder does not exist",
  EPIPE: "the reader closed the pipe",
  EBADF: "it is closed",
  EXDEV: "the temporary file and the target are on different disks",
};

/** The plain reason for an errno code, or the code itself. */
export function writeProblem(code: string | undefined): string {
  return code === undefined ? "an unknown error" : (WRITE_PROBLEMS[code] ?? `error ${code}`);
}
