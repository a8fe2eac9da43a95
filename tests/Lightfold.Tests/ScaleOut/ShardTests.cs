using System.Diagnostics;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.ScaleOut;

public class ShardTests
{
    static string NewDir() => Path.Combine(Path.GetTempPath(), $"lightfold-shard-{Guid.NewGuid():N}");

    static void Run(string dir, params string[] extra)
    {
        var (code, _, err) = CliRunner.Run(["simulate", "--out", dir, "--count", "240", "--seed", "3", "--quiet", .. extra]);
        Assert.True(code == 0, err);
    }

    // Determinism contract (DESIGN.md): the union of the N shard parts equals the single-process run, row for row,
    // for every table (systems, images, observations), for N = 1, 3, 4.
    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(4)]
    public void Union_of_shards_equals_the_single_process_run(int shards)
    {
        string single = NewDir(), sharded = NewDir();
        Run(single);
        for (int k = shards - 1; k >= 0; k--) Run(sharded, "--shard", k.ToString(), "--shards", shards.ToString());
        Assert.Equal(shards, Directory.GetDirectories(Path.Combine(sharded, "systems")).Length);
        Assert.Equal(shards, Directory.GetFiles(Path.Combine(sharded, "manifest.d")).Length);
        CatalogCompare.AssertSameRows(single, sharded);
    }

    [Fact]
    public void Shard_arguments_out_of_range_are_refused()
    {
        string dir = NewDir();
        var (code, _, err) = CliRunner.Run("simulate", "--out", dir, "--shard", "4", "--shards", "4", "--quiet");
        Assert.Equal(2, code);
        Assert.Contains("--shard", err);
        // A different shard count into the same folder is refused.
        Run(dir, "--shard", "0", "--shards", "2");
        var (code2, _, err2) = CliRunner.Run("simulate", "--out", dir, "--count", "240", "--seed", "3", "--shard", "0", "--shards", "3", "--quiet");
        Assert.Equal(2, code2);
        Assert.Contains("shards", err2);
    }
}
