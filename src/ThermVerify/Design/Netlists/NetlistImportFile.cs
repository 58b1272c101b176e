using ThermVerify.Files;
using ThermVerify.Limits;

namespace ThermVerify.Design.Netlists;

/// <summary>Reads a netlist file for <see cref="NetlistImport"/>: bounded, and its includes only from its own folder.</summary>
internal static class NetlistImportFile
{
    public static string Read(string path)
    {
        var full = Path.GetFullPath(path);
        var name = Path.GetFileName(full);
        var folder = Path.GetDirectoryName(full) ?? ".";
        InputText text;
        try
        {
            text = InputFile.Read(full, Work.Limits.MaximumFileBytes);
        }
        catch (InputFileException e)
        {
            throw new DesignException(path, 1, 1, "", $"cannot read the netlist: it {e.Problem}", e.Hint);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new DesignException(path, 1, 1, "", $"cannot read the netlist ({e.Message.TrimEnd('.')})", "Check the path and the file's permissions.");
        }
        return NetlistImport.StartingDesign(text.Text, name, (included, at, errors, _) =>
        {
            if (included.Length == 0 || included.Any(c => c is '"' or '\'' or '`' or '\\' || char.IsControl(c)) || Path.IsPathRooted(included))
                throw errors.At(at, $".include \"{included}\": the path must be relative, without quotes or control characters",
                    "Include a file in the netlist's folder by its relative path.");
            try
            {
                var (_, content) = InputFile.ReadInside(folder, included, Work.Limits.MaximumFileBytes);
                return (included, content.Text);
            }
            catch (InputFileException e)
            {
                throw errors.At(at, $".include \"{included}\": the file {e.Problem}", e.Hint);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw errors.At(at, $".include \"{included}\": the file cannot be read ({e.Message.TrimEnd('.')})", "Check the name and permissions.");
            }
        });
    }
}
