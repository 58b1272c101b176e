using System.Security.Cryptography;
using System.Text;
using ThermVerify.Design;
using ThermVerify.Provenance;

namespace ThermVerify.Tests.Provenance;

/// <summary>The design's digest is the hash anyone can recompute with sha256sum, and it covers every file the design reads.</summary>
public class DesignDigestTests
{
    [Fact]
    public void The_hash_is_sha256_as_published()
    {
        // FIPS 180-4 example "abc" (NIST, Secure Hash Standard, appendix B.1 example / CSRC example values).
        Assert.Equal("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", DesignDigest.Of("abc"u8));
    }

    [Fact]
    public void A_design_reading_no_other_file_is_named_by_its_own_bytes()
    {
        var path = Path.Combine(Repository.Netlists, "buffered-cable-probe.toml");
        var digest = DesignLoader.Load(path).Source!;
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(path))), digest.Sha256);
        Assert.Equal(["buffered-cable-probe.toml"], digest.Files.Select(f => f.Name));
    }

    [Fact]
    public void A_design_with_a_table_is_named_by_the_sha256sum_lines_of_both_files()
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, "table-sensor-freezer.toml"));
        var digest = design.Source!;
        Assert.Equal(["table-sensor-freezer.toml", "table-47k-rt.csv"], digest.Files.Select(f => f.Name));
        // What `sha256sum table-sensor-freezer.toml table-47k-rt.csv | sha256sum` prints in the netlists folder (GNU coreutils' format: hash, two spaces, name).
        var lines = string.Concat(digest.Files.Select(f =>
            $"{Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(Path.Combine(Repository.Netlists, f.Name))))}  {f.Name}\n"));
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(lines))), digest.Sha256);
    }

    [Fact]
    public void Changing_only_the_table_file_changes_the_digest_but_not_the_normal_form()
    {
        var folder = Directory.CreateTempSubdirectory("tv-digest-");
        try
        {
            foreach (var name in new[] { "table-sensor-freezer.toml", "table-47k-rt.csv" })
                File.Copy(Path.Combine(Repository.Netlists, name), Path.Combine(folder.FullName, name));
            var design = Path.Combine(folder.FullName, "table-sensor-freezer.toml");
            var before = DesignLoader.Load(design);
            File.AppendAllText(Path.Combine(folder.FullName, "table-47k-rt.csv"), "# a comment changes the bytes, not the table\n");
            var after = DesignLoader.Load(design);
            Assert.NotEqual(before.Source, after.Source);
            Assert.Equal(before.Source!.Files[0], after.Source!.Files[0]);
            Assert.Equal(DesignWriter.ToToml(before), DesignWriter.ToToml(after));
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Fact]
    public void A_subcircuit_and_the_file_it_includes_are_in_the_digest()
    {
        var folder = Directory.CreateTempSubdirectory("tv-digest-");
        try
        {
            var probe = File.ReadAllText(Path.Combine(Repository.Netlists, "buffered-cable-probe.toml"));
            File.WriteAllText(Path.Combine(folder.FullName, "models.lib"), ".subckt amp inp inn vp vn out\nE1 out 0 inp inn 1e5\n.ends\n");
            File.WriteAllText(Path.Combine(folder.FullName, "opamp.lib"), ".include \"models.lib\"\n");
            var withSubcircuit = probe.Replace("[buffer]", "[buffer]\nsubckt_file = \"opamp.lib\"\nsubckt_name = \"amp\"");
            File.WriteAllText(Path.Combine(folder.FullName, "probe.toml"), withSubcircuit);
            var digest = DesignLoader.Load(Path.Combine(folder.FullName, "probe.toml")).Source!;
            Assert.Equal(["probe.toml", "opamp.lib", "models.lib"], digest.Files.Select(f => f.Name));
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
