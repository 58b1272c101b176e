using ThermVerify.Files;

namespace ThermVerify.Tests.Files;

/// <summary>A change is a change of content, however the editor saves it.</summary>
public class FileSetTests
{
    [Fact]
    public void Saving_the_same_content_is_no_change_and_new_content_is()
    {
        var folder = Directory.CreateTempSubdirectory("tv-fileset-");
        try
        {
            var file = Path.Combine(folder.FullName, "design.toml");
            File.WriteAllText(file, "name = \"a\"\n");
            var set = new FileSet([file]);
            File.WriteAllText(file, "name = \"a\"\n");
            Assert.Empty(set.Changed());
            File.WriteAllText(file, "name = \"b\"\n");
            Assert.Equal([Path.GetFullPath(file)], set.Changed());
            Assert.Empty(set.Changed()); // reported once
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Fact]
    public void A_new_file_renamed_over_the_old_one_is_a_change()
    {
        var folder = Directory.CreateTempSubdirectory("tv-fileset-");
        try
        {
            var file = Path.Combine(folder.FullName, "table.csv");
            File.WriteAllText(file, "0,1000\n");
            var set = new FileSet([file]);
            var saved = Path.Combine(folder.FullName, "table.csv~");
            File.WriteAllText(saved, "0,2000\n");
            File.Move(saved, file, overwrite: true);
            Assert.Single(set.Changed());
            File.Delete(file);
            Assert.Single(set.Changed()); // gone is a change too
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
