using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using Lightfold.Catalog;
using Lightfold.Configuration;
using Lightfold.Populations;

namespace Lightfold.Pipeline;

/// <summary>Receives progress of a long run (systems done out of total).</summary>
public interface IProgressSink
{
    /// <summary>Called after each batch.</summary>
    void Report(long done, long total);
}

/// <summary>What a run did.</summary>
/// <param name="TotalSystems">Systems in the whole run (all shards).</param>
/// <param name="Weight">Weight of each row.</param>
/// <param name="SystemsWritten">Systems rows written by this process.</param>
/// <param name="ImagesWritten">Images rows written by this process.</param>
/// <param name="Skipped">True when the shard was already complete (resume).</param>
/// <param name="Yield">Expected counts.</param>
public sealed record RunSummary(long TotalSystems, double Weight, long SystemsWritten, long ImagesWritten, bool Skipped, LensingYield Yield);

/// <summary>Where and how a run writes.</summary>
/// <param name="OutputDirectory">Dataset folder.</param>
/// <param name="Shard">This process's shard, 0-based.</param>
/// <param name="Shards">Number of shards.</param>
/// <param name="Threads">Worker threads (0 = all cores); output does not depend on it.</param>
/// <param name="ToolVersion">Version written to the metadata.</param>
public sealed record RunTarget(string OutputDirectory, int Shard = 0, int Shards = 1, int Threads = 0, string ToolVersion = "0");

/// <summary>Draws, solves and writes the systems and images of one shard, batch by batch.</summary>
/// <remarks>
/// Systems are numbered 0 … N−1 over the whole run; shard k of S takes ids [kN/S, (k+1)N/S). Each batch is drawn in
/// parallel (every system from its own keyed streams, so thread count changes nothing), then written as one row group
/// per table. Files appear under their final names only when complete; the shard's marker is written last.
/// </remarks>
public static class SimulationRunner
{
    /// <summary>Runs one shard.</summary>
    public static async Task<RunSummary> RunAsync(Scenario scenario, RunTarget target, IProgressSink? progress, CancellationToken ct)
    {
        if (target.Shards < 1 || target.Shard < 0 || target.Shard >= target.Shards)
            throw new InputException($"--shard {target.Shard} --shards {target.Shards}: expected 0 ≤ shard < shards");
        var sampler = new SystemSampler(scenario);
        var (total, weight) = sampler.RunSize();
        string dir = Path.GetFullPath(target.OutputDirectory);
        if (File.Exists(dir)) throw new InputException($"--out '{target.OutputDirectory}' is a file, not a folder");
        DatasetManifest.EnsureMatches(dir, DatasetManifest.Identity(scenario.ResolvedJson, scenario.Seed, target.Shards, target.ToolVersion));
        if (DatasetManifest.IsComplete(dir, target.Shard))
            return new RunSummary(total, weight, 0, 0, true, sampler.Yield);

        long first = total * target.Shard / target.Shards, end = total * (target.Shard + 1) / target.Shards;
        int batchSize = (int)Math.Min(scenario.Run.BatchSize, Math.Max(1, end - first));
        var systems = CatalogSchema.Systems(batchSize);
        var images = CatalogSchema.Images(batchSize * 4);
        var drawn = new LensedSystem[batchSize];
        var metadata = Metadata(scenario, sampler, target, total, weight);

        await using var systemsWriter = await ParquetTableWriter.CreateAsync(CatalogSchema.PartPath(dir, CatalogSchema.SystemsTable, target.Shard), systems, With(metadata, CatalogSchema.SystemsTable), ct);
        await using var imagesWriter = await ParquetTableWriter.CreateAsync(CatalogSchema.PartPath(dir, CatalogSchema.ImagesTable, target.Shard), images, With(metadata, CatalogSchema.ImagesTable), ct);
        var options = new ParallelOptions { MaxDegreeOfParallelism = target.Threads > 0 ? target.Threads : Environment.ProcessorCount, CancellationToken = ct };
        for (long start = first; start < end; start += batchSize)
        {
            ct.ThrowIfCancellationRequested();
            int n = (int)Math.Min(batchSize, end - start);
            long batchStart = start;
            Parallel.For(0, n, options, () => 0, (i, _, local) =>
            {
                sampler.Draw(batchStart + i, weight, ref drawn[i]);
                return local;
            }, _ => { });
            Fill(drawn.AsSpan(0, n), systems, images);
            await systemsWriter.WriteAsync(systems, ct);
            await imagesWriter.WriteAsync(images, ct);
            progress?.Report(start + n - first, end - first);
        }
        await systemsWriter.CommitAsync();
        await imagesWriter.CommitAsync();
        DatasetManifest.MarkComplete(dir, target.Shard, new JsonObject
        {
            ["shard"] = target.Shard,
            ["shards"] = target.Shards,
            ["first_system_id"] = first,
            ["systems"] = systemsWriter.RowsWritten,
            ["images"] = imagesWriter.RowsWritten,
        });
        return new RunSummary(total, weight, systemsWriter.RowsWritten, imagesWriter.RowsWritten, false, sampler.Yield);
    }

    static Dictionary<string, string> With(Dictionary<string, string> metadata, string table)
        => new(metadata) { ["lightfold.table"] = table };

    static Dictionary<string, string> Metadata(Scenario scenario, SystemSampler sampler, RunTarget target, long total, double weight)
    {
        var p = scenario.Cosmology;
        var cosmology = new JsonObject
        {
            ["h0_kms_mpc"] = p.H0KmSMpc, ["omega_m0"] = p.OmegaM0, ["omega_k0"] = p.OmegaK0,
            ["omega_de0"] = sampler.Cosmology.OmegaDarkEnergy0, ["w0"] = p.W0, ["wa"] = p.WA,
            ["tcmb0_k"] = p.TcmbK, ["neff"] = p.Neff, ["neutrino_masses_ev"] = new JsonArray(p.NeutrinoMassesEv.Select(m => (JsonNode)m).ToArray()),
        };
        var expected = new JsonObject();
        foreach (var (type, y) in sampler.Yield.ByType) expected[TransientTypes.Name(type)] = y.Lensed;
        return new Dictionary<string, string>
        {
            ["lightfold.schema_version"] = CatalogSchema.Version,
            ["lightfold.tool_version"] = target.ToolVersion,
            ["lightfold.seed"] = scenario.Seed.ToString(CultureInfo.InvariantCulture),
            ["lightfold.config"] = scenario.ResolvedJson,
            ["lightfold.cosmology"] = cosmology.ToJsonString(),
            ["lightfold.mode"] = scenario.Run.Mode == RunMode.Oversample ? "oversample" : "realization",
            ["lightfold.total_systems"] = total.ToString(CultureInfo.InvariantCulture),
            ["lightfold.weight"] = weight.ToString("R", CultureInfo.InvariantCulture),
            ["lightfold.expected_lensed_events"] = sampler.Yield.TotalLensed.ToString("R", CultureInfo.InvariantCulture),
            ["lightfold.expected_lensed_by_type"] = expected.ToJsonString(),
            ["lightfold.explosion_years"] = scenario.Survey.ExplosionYears.ToString("R", CultureInfo.InvariantCulture),
            ["lightfold.shard"] = $"{target.Shard}/{target.Shards}",
            ["lightfold.note"] = "simulated, not observed",
        };
    }

    static void Fill(ReadOnlySpan<LensedSystem> drawn, TableBuffer systems, TableBuffer images)
    {
        systems.Count = 0;
        int imageRows = 0;
        foreach (ref readonly var s in drawn) imageRows += s.ImageCount;
        images.EnsureCapacity(imageRows);
        systems.EnsureCapacity(drawn.Length);
        long[] sid = systems.L(Columns.SystemId);
        double[] weight = systems.D(Columns.Weight), zl = systems.D(Columns.ZLens), zsrc = systems.D(Columns.ZSource),
            sig = systems.D(Columns.LensSigmaVKms), te = systems.D(Columns.ThetaEArcsec), q = systems.D(Columns.LensQ),
            pa = systems.D(Columns.LensPaDeg), g = systems.D(Columns.ShearGamma), gpa = systems.D(Columns.ShearPaDeg),
            sx = systems.D(Columns.SourceXArcsec), sy = systems.D(Columns.SourceYArcsec), t0 = systems.D(Columns.T0Mjd),
            mb = systems.D(Columns.PeakAbsoluteBMag), ddt = systems.D(Columns.TimeDelayDistanceMpc), maxDelay = systems.D(Columns.MaxDelayDays),
            maxSep = systems.D(Columns.MaxSeparationArcsec), totalMu = systems.D(Columns.TotalMagnification);
        string[] type = systems.S(Columns.TransientType);
        int[] nImages = systems.I(Columns.NImages);
        bool[] caustic = systems.B(Columns.OnCaustic);

        long[] iid = images.L(Columns.SystemId);
        int[] index = images.I(Columns.ImageIndex);
        double[] x = images.D(Columns.XArcsec), y = images.D(Columns.YArcsec), mu = images.D(Columns.Magnification),
            delay = images.D(Columns.DelayDays), kappa = images.D(Columns.Kappa), gamma = images.D(Columns.Gamma);
        int row = 0;
        for (int i = 0; i < drawn.Length; i++)
        {
            ref readonly var s = ref drawn[i];
            sid[i] = s.SystemId; weight[i] = s.Weight; type[i] = TransientTypes.Name(s.Type);
            zl[i] = s.ZLens; zsrc[i] = s.ZSource; sig[i] = s.SigmaVKms; te[i] = s.Lens.ThetaEArcsec; q[i] = s.Lens.AxisRatio;
            pa[i] = s.Lens.PositionAngleDeg; g[i] = s.Lens.ShearGamma; gpa[i] = s.Lens.ShearPositionAngleDeg;
            sx[i] = s.SourceXArcsec; sy[i] = s.SourceYArcsec; nImages[i] = s.ImageCount; caustic[i] = s.Status == Lensing.ImageSetStatus.OnCaustic;
            t0[i] = s.T0Mjd; mb[i] = s.PeakAbsoluteBMag; ddt[i] = s.TimeDelayDistanceMpc;
            double sep = 0, sum = 0;
            for (int a = 0; a < s.ImageCount; a++)
            {
                var im = s.Images[a];
                sum += Math.Abs(im.Magnification);
                for (int b = 0; b < a; b++)
                    sep = Math.Max(sep, Math.Sqrt(Math.Pow(im.XArcsec - s.Images[b].XArcsec, 2) + Math.Pow(im.YArcsec - s.Images[b].YArcsec, 2)));
                iid[row] = s.SystemId; index[row] = a; x[row] = im.XArcsec; y[row] = im.YArcsec; mu[row] = im.Magnification;
                delay[row] = s.DelaysDays[a]; kappa[row] = im.Kappa; gamma[row] = im.Gamma;
                row++;
            }
            maxDelay[i] = s.ImageCount > 0 ? s.DelaysDays[s.ImageCount - 1] : 0;
            maxSep[i] = sep;
            totalMu[i] = sum;
        }
        systems.Count = drawn.Length;
        images.Count = row;
    }
}
