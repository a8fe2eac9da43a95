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
/// <param name="ObservationsWritten">Observations rows written by this process (0 without light curves).</param>
/// <param name="Detected">Systems meeting the detection rule, and their summed weight (light curves only).</param>
/// <param name="Skipped">True when the shard was already complete (resume).</param>
/// <param name="Yield">Expected counts.</param>
public sealed record RunSummary(long TotalSystems, double Weight, long SystemsWritten, long ImagesWritten, long ObservationsWritten,
    (long Count, double Weight) Detected, bool Skipped, LensingYield Yield);

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
    /// <summary>Rows per observations row group.</summary>
    const int ObservationRowGroup = 1 << 18;

    /// <summary>Systems per compute batch when light curves are on (their rows are held until written).</summary>
    const int LightCurveBatch = 1024;

    /// <summary>Runs one shard.</summary>
    public static async Task<RunSummary> RunAsync(Scenario scenario, RunTarget target, IProgressSink? progress, CancellationToken ct)
    {
        if (target.Shards < 1 || target.Shard < 0 || target.Shard >= target.Shards)
            throw new InputException($"--shard {target.Shard} --shards {target.Shards}: expected 0 ≤ shard < shards");
        bool lightCurves = scenario.Observing.LightCurves;
        // Everything read from files is read before anything is written.
        var observing = lightCurves ? ObservationStage.Create(scenario) : null;
        var sampler = new SystemSampler(scenario);
        var (total, weight) = sampler.RunSize();
        string dir = Path.GetFullPath(target.OutputDirectory);
        DatasetManifest.EnsureMatches(dir, DatasetManifest.Identity(scenario.ResolvedJson, scenario.Seed, target.Shards, target.ToolVersion));
        if (DatasetManifest.IsComplete(dir, target.Shard))
            return new RunSummary(total, weight, 0, 0, 0, (0, 0), true, sampler.Yield);

        // A run killed without warning (SIGKILL, power loss) leaves temporary files; they never became parts. Remove them.
        foreach (string table in new[] { CatalogSchema.SystemsTable, CatalogSchema.ImagesTable, CatalogSchema.ObservationsTable })
            DatasetManifest.RemoveStalePartials(Path.GetDirectoryName(CatalogSchema.PartPath(dir, table, target.Shard))!);

        long first = total * target.Shard / target.Shards, end = total * (target.Shard + 1) / target.Shards;
        int batchSize = (int)Math.Min(lightCurves ? Math.Min(scenario.Run.BatchSize, LightCurveBatch) : scenario.Run.BatchSize, Math.Max(1, end - first));
        bool training = scenario.Run.Mode == RunMode.Training;
        var systems = CatalogSchema.Systems(batchSize, lightCurves, training);
        var features = training ? CatalogSchema.Features(batchSize * observing!.BandNames.Length) : null;
        var featureSlots = training ? Enumerable.Range(0, batchSize).Select(_ => new BandFeatures[observing!.BandNames.Length]).ToArray() : [];
        var images = CatalogSchema.Images(batchSize * 4, lightCurves);
        var observations = lightCurves ? CatalogSchema.Observations(ObservationRowGroup) : null;
        var drawn = new LensedSystem[batchSize];
        var records = lightCurves ? Enumerable.Range(0, batchSize).Select(_ => new SystemObservations()).ToArray() : [];
        var visitLists = lightCurves ? Enumerable.Range(0, batchSize).Select(_ => new List<Survey.Visit>()).ToArray() : [];
        var metadata = Metadata(scenario, sampler, target, total, weight);

        await using var systemsWriter = await ParquetTableWriter.CreateAsync(CatalogSchema.PartPath(dir, CatalogSchema.SystemsTable, target.Shard), systems, With(metadata, CatalogSchema.SystemsTable), ct);
        await using var imagesWriter = await ParquetTableWriter.CreateAsync(CatalogSchema.PartPath(dir, CatalogSchema.ImagesTable, target.Shard), images, With(metadata, CatalogSchema.ImagesTable), ct);
        await using var featuresWriter = features is null ? null
            : await ParquetTableWriter.CreateAsync(CatalogSchema.PartPath(dir, CatalogSchema.FeaturesTable, target.Shard), features, With(metadata, CatalogSchema.FeaturesTable), ct);
        await using var observationsWriter = observations is null ? null
            : await ParquetTableWriter.CreateAsync(CatalogSchema.PartPath(dir, CatalogSchema.ObservationsTable, target.Shard), observations, With(observing!.Metadata(metadata), CatalogSchema.ObservationsTable), ct);
        var options = new ParallelOptions { MaxDegreeOfParallelism = target.Threads > 0 ? target.Threads : Environment.ProcessorCount, CancellationToken = ct };
        long detectedCount = 0;
        double detectedWeight = 0;
        for (long start = first; start < end; start += batchSize)
        {
            ct.ThrowIfCancellationRequested();
            int n = (int)Math.Min(batchSize, end - start);
            long batchStart = start;
            Parallel.For(0, n, options, i =>
            {
                sampler.Draw(batchStart + i, weight, ref drawn[i]);
                observing?.Simulate(in drawn[i], records[i], visitLists[i]);
                if (training) observing!.Features(records[i], featureSlots[i]);
            });
            Fill(drawn.AsSpan(0, n), systems, images, lightCurves ? records : null, observing?.BandNames);
            if (training)
            {
                FillTraining(drawn.AsSpan(0, n), systems, scenario.Run.Training);
                FillFeatures(drawn.AsSpan(0, n), featureSlots, observing!.BandNames, features!);
                await featuresWriter!.WriteAsync(features!, ct);
            }
            await systemsWriter.WriteAsync(systems, ct);
            await imagesWriter.WriteAsync(images, ct);
            if (observationsWriter is not null)
            {
                for (int i = 0; i < n; i++)
                {
                    if (records[i].Detected) { detectedCount++; detectedWeight += drawn[i].Weight; }
                    if (observations!.Count + records[i].Count > ObservationRowGroup && observations.Count > 0)
                    {
                        await observationsWriter.WriteAsync(observations, ct);
                        observations.Count = 0;
                    }
                    ObservationStage.Append(drawn[i].SystemId, records[i], observations, observing!.BandNames);
                }
            }
            progress?.Report(start + n - first, end - first);
        }
        if (observationsWriter is not null)
        {
            await observationsWriter.WriteAsync(observations!, ct);
            await observationsWriter.CommitAsync();
        }
        if (featuresWriter is not null) await featuresWriter.CommitAsync();
        await systemsWriter.CommitAsync();
        await imagesWriter.CommitAsync();
        DatasetManifest.MarkComplete(dir, target.Shard, new JsonObject
        {
            ["shard"] = target.Shard,
            ["shards"] = target.Shards,
            ["first_system_id"] = first,
            ["systems"] = systemsWriter.RowsWritten,
            ["images"] = imagesWriter.RowsWritten,
            ["observations"] = observationsWriter?.RowsWritten ?? 0,
        });
        return new RunSummary(total, weight, systemsWriter.RowsWritten, imagesWriter.RowsWritten, observationsWriter?.RowsWritten ?? 0,
            (detectedCount, detectedWeight), false, sampler.Yield);
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
            ["lightfold.mode"] = scenario.Run.Mode switch { RunMode.Oversample => "oversample", RunMode.Realization => "realization", _ => "training" },
            ["lightfold.truth_columns"] = "systems: all but system_id, label, split are truth (never classifier inputs); images: all; observations: true_flux_njy, micro_magnification, image_index, blend_group; features: observed only",
            ["lightfold.total_systems"] = total.ToString(CultureInfo.InvariantCulture),
            ["lightfold.weight"] = weight.ToString("R", CultureInfo.InvariantCulture),
            ["lightfold.expected_lensed_events"] = sampler.Yield.TotalLensed.ToString("R", CultureInfo.InvariantCulture),
            ["lightfold.expected_lensed_by_type"] = expected.ToJsonString(),
            ["lightfold.explosion_years"] = scenario.Survey.ExplosionYears.ToString("R", CultureInfo.InvariantCulture),
            ["lightfold.shard"] = $"{target.Shard}/{target.Shards}",
            ["lightfold.note"] = "simulated, not observed",
        };
    }

    static void FillTraining(ReadOnlySpan<LensedSystem> drawn, TableBuffer systems, TrainingSettings training)
    {
        string[] label = systems.S(Columns.Label), split = systems.S(Columns.Split);
        for (int i = 0; i < drawn.Length; i++)
        {
            label[i] = drawn[i].Lensed ? "lensed" : "unlensed";
            split[i] = training.SplitOf(drawn[i].SystemId);
        }
    }

    static void FillFeatures(ReadOnlySpan<LensedSystem> drawn, BandFeatures[][] slots, string[] bands, TableBuffer table)
    {
        table.EnsureCapacity(drawn.Length * bands.Length);
        long[] id = table.L(Columns.SystemId);
        string[] band = table.S(Columns.Band);
        int[] visits = table.I(Columns.NVisits), det = table.I(Columns.NDetections);
        double[] peak = table.D(Columns.PeakFluxNjy), peakMjd = table.D(Columns.PeakMjd), rise = table.D(Columns.RiseDays), decline = table.D(Columns.DeclineDays), colour = table.D(Columns.ColourToNextBandMag);
        int row = 0;
        for (int i = 0; i < drawn.Length; i++)
            for (int b = 0; b < bands.Length; b++, row++)
            {
                var f = slots[i][b];
                id[row] = drawn[i].SystemId; band[row] = bands[b]; visits[row] = f.Visits; det[row] = f.Detections;
                peak[row] = f.PeakFluxNjy; peakMjd[row] = f.PeakMjd; rise[row] = f.RiseDays; decline[row] = f.DeclineDays; colour[row] = f.ColourToNextBandMag;
            }
        table.Count = row;
    }

    static void Fill(ReadOnlySpan<LensedSystem> drawn, TableBuffer systems, TableBuffer images, SystemObservations[]? records, string[]? bandNames)
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
            delay = images.D(Columns.DelayDays), kappa = images.D(Columns.Kappa), gamma = images.D(Columns.Gamma), kappaStar = images.D(Columns.KappaStar);
        int row = 0;
        for (int i = 0; i < drawn.Length; i++)
        {
            ref readonly var s = ref drawn[i];
            sid[i] = s.SystemId; weight[i] = s.Weight; type[i] = TransientTypes.Name(s.Type);
            zl[i] = s.ZLens; zsrc[i] = s.ZSource; sig[i] = s.SigmaVKms;
            te[i] = s.Lens?.ThetaEArcsec ?? double.NaN; q[i] = s.Lens?.AxisRatio ?? double.NaN;
            pa[i] = s.Lens?.PositionAngleDeg ?? double.NaN; g[i] = s.Lens?.ShearGamma ?? double.NaN; gpa[i] = s.Lens?.ShearPositionAngleDeg ?? double.NaN;
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
                delay[row] = s.DelaysDays[a]; kappa[row] = im.Kappa; gamma[row] = im.Gamma; kappaStar[row] = s.KappaStars[a];
                row++;
            }
            maxDelay[i] = s.ImageCount > 0 ? s.DelaysDays[s.ImageCount - 1] : 0;
            maxSep[i] = sep;
            totalMu[i] = sum;
        }
        systems.Count = drawn.Length;
        images.Count = row;
        if (records is null) return;
        bool[] detected = systems.B(Columns.Detected);
        int[] nDet = systems.I(Columns.NDetections);
        double[] firstDet = systems.D(Columns.FirstDetectionMjd), ebv = systems.D(Columns.HostEbvMag);
        double[] peakMag = images.D(Columns.PeakMag);
        string[] peakBand = images.S(Columns.PeakBand);
        row = 0;
        for (int i = 0; i < drawn.Length; i++)
        {
            var o = records[i];
            detected[i] = o.Detected; nDet[i] = o.Detections; firstDet[i] = o.FirstDetectionMjd; ebv[i] = o.HostEbv;
            for (int a = 0; a < drawn[i].ImageCount; a++, row++)
            {
                peakMag[row] = o.PeakMag[a];
                peakBand[row] = o.PeakBand[a] >= 0 ? bandNames![o.PeakBand[a]] : "";
            }
        }
    }
}
